/**
 * A UTC instant as a MariaDB DATETIME(3) literal ('2026-12-01 21:30:00.250'), without going
 * through Date formatting: on the ingest path a batch of 500 readings spent most of its SQL
 * building time formatting dates. The day part is cached (a batch spans few days).
 */
const DAY_MS = 86_400_000;
let cachedDay = NaN;
let cachedPrefix = '';

const pad2 = (n: number) => (n < 10 ? '0' + n : String(n));
const pad3 = (n: number) => (n < 10 ? '00' + n : n < 100 ? '0' + n : String(n));

export function sqlUtc(ms: number): string {
  if (!Number.isFinite(ms)) throw new RangeError('sqlUtc needs a finite time');
  const day = Math.floor(ms / DAY_MS);
  if (day !== cachedDay) {
    cachedDay = day;
    cachedPrefix = new Date(day * DAY_MS).toISOString().slice(0, 10) + ' ';
  }
  let rest = ms - day * DAY_MS;
  const h = Math.floor(rest / 3_600_000);
  rest -= h * 3_600_000;
  const m = Math.floor(rest / 60_000);
  rest -= m * 60_000;
  const s = Math.floor(rest / 1000);
  return `${cachedPrefix}${pad2(h)}:${pad2(m)}:${pad2(s)}.${pad3(Math.round(rest - s * 1000))}`;
}

/** A finite number as an SQL literal; anything else is refused (callers pass validated numbers). */
export function sqlNumber(x: number): string {
  if (!Number.isFinite(x)) throw new TypeError('not a finite number');
  return String(x);
}
