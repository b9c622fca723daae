import { formatPercent } from '@/lib/format/units';

/**
 * The bank as a reservoir, on an energy scale (never linear in volts): the left end is the
 * converter cutoff, the right end a full bank. The hatched stretch below the burst floor is
 * energy the node cannot spend; the ember fill is what it holds now.
 */
export function BankGauge({ soc, floorSoc }: { soc: number | null; floorSoc: number }) {
  const fill = Math.max(0, Math.min(1, soc ?? 0));
  const floor = Math.max(0, Math.min(1, floorSoc));
  return (
    <figure className="w-full" aria-label={`State of charge ${formatPercent(soc)} of usable energy; burst floor at ${formatPercent(floorSoc)}`}>
      <svg viewBox="0 0 200 18" preserveAspectRatio="none" className="h-4 w-full" aria-hidden="true">
        <defs>
          <pattern id="below-floor" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2="4" stroke="rgb(var(--hazard))" strokeOpacity="0.45" strokeWidth="1.5" />
          </pattern>
        </defs>
        <rect x="0" y="2" width="200" height="14" rx="7" fill="rgb(var(--dusk-800))" />
        <rect x="0" y="2" width={200 * fill} height="14" rx="7" fill="rgb(var(--ember))" />
        <rect x="0" y="2" width={200 * floor} height="14" fill="url(#below-floor)" />
        <line x1={200 * floor} x2={200 * floor} y1="0" y2="18" stroke="rgb(var(--hazard))" strokeWidth="1.2" strokeDasharray="2 1.5" />
      </svg>
      <figcaption className="mt-1 flex justify-between gap-2 text-[11px] text-ink-faint">
        <span>cutoff</span>
        <span className="text-hazard">┊ burst floor at {formatPercent(floorSoc)} · hatched below it</span>
        <span>full</span>
      </figcaption>
    </figure>
  );
}
