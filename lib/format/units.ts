/** Numbers with their units, formatted once for every screen. */
const dash = '—';

export function formatVolts(v: number | null | undefined, digits = 3): string {
  return v == null || !Number.isFinite(v) ? dash : `${v.toFixed(digits)} V`;
}

export function formatJoules(j: number | null | undefined): string {
  if (j == null || !Number.isFinite(j)) return dash;
  return Math.abs(j) >= 10_000 ? `${(j / 1000).toFixed(1)} kJ` : `${j.toFixed(0)} J`;
}

/** Watt-hours beside joules: 1 Wh = 3600 J. */
export function formatWattHours(j: number | null | undefined): string {
  return j == null || !Number.isFinite(j) ? dash : `${(j / 3600).toFixed(j / 3600 >= 10 ? 1 : 3)} Wh`;
}

export function formatWatts(w: number | null | undefined): string {
  if (w == null || !Number.isFinite(w)) return dash;
  const a = Math.abs(w);
  if (a < 1e-3) return `${(w * 1e6).toFixed(0)} µW`;
  if (a < 1) return `${(w * 1e3).toFixed(2)} mW`;
  return `${w.toFixed(2)} W`;
}

export function formatAmps(a: number | null | undefined): string {
  if (a == null || !Number.isFinite(a)) return dash;
  const abs = Math.abs(a);
  if (abs < 1e-3) return `${(a * 1e6).toFixed(1)} µA`;
  if (abs < 1) return `${(a * 1e3).toFixed(1)} mA`;
  return `${a.toFixed(abs >= 100 ? 0 : 1)} A`;
}

export function formatMargin(m: number | null | undefined): string {
  return m == null || !Number.isFinite(m) ? dash : `${m.toFixed(2)}×`;
}

export function formatPercent(fraction: number | null | undefined): string {
  return fraction == null || !Number.isFinite(fraction) ? dash : `${Math.round(fraction * 100)} %`;
}

/** "4 min ago", "3 h ago", "2 d ago". */
export function formatAge(at: Date | string | null | undefined, now = new Date()): string {
  if (!at) return 'never';
  const s = Math.max(0, (now.getTime() - new Date(at).getTime()) / 1000);
  if (s < 90) return `${Math.round(s)} s ago`;
  if (s < 5400) return `${Math.round(s / 60)} min ago`;
  if (s < 172_800) return `${Math.round(s / 3600)} h ago`;
  return `${Math.round(s / 86_400)} d ago`;
}
