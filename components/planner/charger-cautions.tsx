/**
 * Cautions where a person can be hurt or a port damaged (DESIGN.md §3). The USB figures are
 * common practice: 500 mA from a USB 2.0 port, 900 mA from USB 3.x, more only by negotiation.
 */
export function ChargerCautions({ chargerAmps }: { chargerAmps: number }) {
  const overPort = Number.isFinite(chargerAmps) && chargerAmps > 0.5;
  return (
    <div className="flex flex-col gap-2 text-sm" data-testid="charger-cautions">
      <p className={`rounded-md border px-3 py-2 ${overPort ? 'border-hazard text-ink' : 'border-dusk-600 text-ink-muted'}`} role={overPort ? 'alert' : undefined}>
        <strong className={overPort ? 'text-hazard' : 'text-ink'}>Caution: </strong>
        a charger drawing more than a computer port supplies (about 0.5 A from a USB 2.0 port, 0.9 A from USB 3) needs its own
        supply{overPort ? ` — ${chargerAmps} A is more than a plain port gives` : ''}. Never charge cells above their rated voltage.
      </p>
      <p className="rounded-md border border-dusk-600 px-3 py-2 text-ink-muted">
        <strong className="text-ink">Outdoors: </strong>
        a mains-powered charger in an outdoor enclosure must follow your local electrical codes and the cell maker&apos;s ratings.
      </p>
    </div>
  );
}
