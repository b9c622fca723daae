import Link from 'next/link';
import { StateGlyph } from '@/components/state-glyph';
import { NODE_STATE_INFO, NODE_STATES } from '@/lib/config/node-states';

export default function LandingPage() {
  return (
    <main className="mx-auto flex min-h-screen max-w-5xl flex-col px-6 py-10">
      <header className="flex items-center justify-between">
        <span className="flex items-center gap-2 text-lg font-bold tracking-wide">
          <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
            <path d="M2 15 H20" stroke="rgb(var(--ink-faint))" strokeWidth="1.5" />
            <path d="M5 15 A6 6 0 0 1 17 15" fill="rgb(var(--ember))" />
          </svg>
          Duskwatch
        </span>
        <Link href="/sign-in" className="rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800" data-testid="landing-sign-in">
          Sign in
        </Link>
      </header>

      <section className="mt-20 grid gap-12 md:grid-cols-[3fr_2fr] md:items-end">
        <div>
          <p className="text-sm font-bold uppercase tracking-[0.2em] text-tide">Before dusk, every day</p>
          <h1 className="mt-4 text-4xl font-bold leading-tight md:text-5xl">Who makes it through tonight?</h1>
          <p className="mt-6 max-w-xl text-lg text-ink-muted">
            Duskwatch models the energy left in each supercapacitor bank of your solar sensor nodes, tells you before
            dusk which ones will reach sunrise and with what margin, and e-mails you while there is still time to
            stretch the cadence, clean a panel or swap cells.
          </p>
          <div className="mt-8 flex gap-3">
            <Link href="/sign-in" className="rounded-md bg-ember px-5 py-3 font-bold text-dusk-950 hover:opacity-90">
              Sign in to your fleet
            </Link>
          </div>
        </div>
        <dl className="rounded-xl border border-dusk-700 bg-dusk-900 p-5" aria-label="Node states">
          {NODE_STATES.map((s) => (
            <div key={s} className="flex items-start gap-3 border-b border-dusk-800 py-2.5 last:border-0">
              <dt className="w-20 shrink-0"><StateGlyph state={s} /></dt>
              <dd className="text-sm text-ink-muted">{NODE_STATE_INFO[s].meaning}</dd>
            </div>
          ))}
        </dl>
      </section>

      <section className="mt-20 grid gap-6 text-sm text-ink-muted md:grid-cols-3">
        <div><h2 className="font-bold text-ink">Night margin</h2><p className="mt-2">Reserve above the burst floor, divided by what the load draws until the sun is back at your site.</p></div>
        <div><h2 className="font-bold text-ink">Why it trends worse</h2><p className="mt-2">Measured overnight draw against the model: lost capacitance, leakage, firmware stuck awake, a shaded panel.</p></div>
        <div><h2 className="font-bold text-ink">Plan and characterize</h2><p className="mt-2">Size a bank for the longest night at your latitude; measure a batch of cells on the bench before it goes out.</p></div>
      </section>

      <footer className="mt-auto pt-16 text-xs text-ink-faint">
        A charged bank can deliver hundreds of amps into a short. Follow the cell maker&apos;s ratings and your local electrical codes.
      </footer>
    </main>
  );
}
