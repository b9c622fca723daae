import type { BankWattsAt } from './types';

// Discharge of a bank feeding a voltage-dependent power P(V): C·V·dV/dt = −P(V), so the time
// to fall from V0 to V is t = ∫_V^V0 C·u/P(u) du. Integrating over voltage (not time) gives
// brownout instants directly and needs only a few hundred evaluations of P for a 7-day window:
// Simpson panels, split at the efficiency table's kinks so each panel sees a smooth integrand.

export interface DischargeTable {
  /** Node voltages, descending from the start voltage to the stop voltage. */
  volts: number[];
  /** Cumulative seconds from the start to each node. */
  seconds: number[];
  integrand: (volts: number) => number;
}

const DEFAULT_PANELS = 48;

export function buildDischargeTable({
  farads,
  fromVolts,
  downToVolts,
  bankWattsAt,
  breakVolts = [],
  panels = DEFAULT_PANELS,
}: {
  farads: number;
  fromVolts: number;
  downToVolts: number;
  bankWattsAt: BankWattsAt;
  breakVolts?: number[];
  panels?: number;
}): DischargeTable {
  const integrand = (u: number) => {
    const watts = bankWattsAt(u);
    return watts > 0 ? (farads * u) / watts : Number.POSITIVE_INFINITY;
  };
  const volts = panelNodes({ fromVolts, downToVolts, breakVolts, panels });
  const seconds = [0];
  for (let k = 1; k < volts.length; k++) {
    seconds.push(seconds[k - 1] + simpson(integrand, volts[k], volts[k - 1]));
  }
  return { volts, seconds, integrand };
}

/** Seconds from the table's start down to `volts` (Infinity below the table's stop voltage). */
export function secondsAtVolts({ table, volts }: { table: DischargeTable; volts: number }): number {
  const { volts: nodes, seconds } = table;
  if (volts >= nodes[0]) return 0;
  for (let k = 1; k < nodes.length; k++) {
    if (volts >= nodes[k]) return seconds[k - 1] + simpson(table.integrand, volts, nodes[k - 1]);
  }
  return Number.POSITIVE_INFINITY;
}

/** Bank voltage `seconds` after the start, or null once the discharge has passed the stop voltage. */
export function voltsAtSeconds({ table, seconds }: { table: DischargeTable; seconds: number }): number | null {
  const { volts: nodes, seconds: times, integrand } = table;
  if (seconds <= 0) return nodes[0];
  const k = times.findIndex((t) => t >= seconds);
  if (k < 0) return null;
  const top = nodes[k - 1];
  const bottom = nodes[k];
  const remaining = seconds - times[k - 1];
  if (!Number.isFinite(times[k])) return top; // power vanished below here: the voltage stalls
  // Newton on g(V) = ∫_V^top f − remaining, with g'(V) = −f(V); kept inside the panel.
  let v = top - ((top - bottom) * remaining) / (times[k] - times[k - 1]);
  for (let i = 0; i < 6; i++) {
    const g = simpson(integrand, v, top) - remaining;
    const next = Math.min(top, Math.max(bottom, v + g / integrand(v)));
    if (Math.abs(next - v) < 1e-9) return next;
    v = next;
  }
  return v;
}

/** Samples of the discharge every `stepSeconds` up to `untilSeconds` or the stop voltage. */
export function traceDischarge({
  table,
  stepSeconds,
  untilSeconds,
}: {
  table: DischargeTable;
  stepSeconds: number;
  untilSeconds: number;
}): { t: number; volts: number }[] {
  const points: { t: number; volts: number }[] = [];
  for (let t = 0; t <= untilSeconds + 1e-9; t += stepSeconds) {
    const volts = voltsAtSeconds({ table, seconds: t });
    if (volts === null) break;
    points.push({ t, volts });
  }
  const endSeconds = Math.min(untilSeconds, table.seconds[table.seconds.length - 1]);
  if (points.length > 0 && points[points.length - 1].t < endSeconds) {
    points.push({ t: endSeconds, volts: voltsAtSeconds({ table, seconds: endSeconds }) ?? table.volts.at(-1)! });
  }
  return points;
}

function panelNodes({
  fromVolts,
  downToVolts,
  breakVolts,
  panels,
}: {
  fromVolts: number;
  downToVolts: number;
  breakVolts: number[];
  panels: number;
}): number[] {
  const span = fromVolts - downToVolts;
  if (span <= 0) return [fromVolts];
  const inner = breakVolts.filter((v) => v < fromVolts && v > downToVolts).sort((a, b) => b - a);
  const edges = [fromVolts, ...inner, downToVolts];
  const nodes = [fromVolts];
  for (let s = 1; s < edges.length; s++) {
    const top = edges[s - 1];
    const length = top - edges[s];
    const count = Math.max(2, Math.ceil((panels * length) / span));
    // the segment's last node is its edge exactly, so the stop voltage is a node, not a rounding away
    for (let i = 1; i <= count; i++) nodes.push(i === count ? edges[s] : top - (length * i) / count);
  }
  return nodes;
}

function simpson(f: (x: number) => number, low: number, high: number): number {
  if (high <= low) return 0;
  const mid = (low + high) / 2;
  return ((high - low) / 6) * (f(low) + 4 * f(mid) + f(high));
}
