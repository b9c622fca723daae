/**
 * A UTC instant as a MariaDB DATETIME(3) literal ('2026-12-01 21:30:00.250'), without going
 * through Date formatting: on the ingest path a batch of 500 readings spent most of its SQL
 * building time formatting dates. Times are whole milliseconds (Date.getTime()).
 */
const HOUR_MS = 3_600_000;
// The hour's text ('2026-12-01 21:') is cached: a post's readings share few hours.
let cachedHour = NaN;
let cachedPrefix = '';

const TWO = Array.from({ length: 60 }, (_, n) => String(n).padStart(2, '0'));
const THREE = Array.from({ length: 1000 }, (_, n) => String(n).padStart(3, '0'));

export function sqlUtc(ms: number): string {
  if (!Number.isInteger(ms)) throw new RangeError('sqlUtc needs a time in whole milliseconds');
  const hour = Math.floor(ms / HOUR_MS);
  if (hour !== cachedHour) {
    cachedHour = hour;
    cachedPrefix = new Date(hour * HOUR_MS).toISOString().slice(0, 14).replace('T', ' ');
  }
  const rest = ms - hour * HOUR_MS; // whole milliseconds: ms is an integer
  const m = Math.floor(rest / 60_000);
  const s = Math.floor((rest - m * 60_000) / 1000);
  return cachedPrefix + TWO[m] + ':' + TWO[s] + '.' + THREE[rest - m * 60_000 - s * 1000];
}

// '.5', '.51', '.512' for the thousandths 500, 510, 512; '' for 0.
const THOUSANDTHS = THREE.map((digits, n) => (n === 0 ? '' : '.' + digits.replace(/0+$/, '')));

/**
 * A finite number as an SQL literal; anything else is refused (callers pass validated numbers).
 * The text is String(x)'s. Readings mostly carry three decimals or fewer (millivolts), and
 * those are written from their integer thousandths, which is about twice as fast as the
 * engine's shortest-digits formatting of a double (tests/unit/db/sql-number.test.ts holds the
 * two equal); any other number goes to String.
 */
export function sqlNumber(x: number): string {
  if (!Number.isFinite(x)) throw new TypeError('not a finite number');
  if (Number.isInteger(x)) return String(x);
  const k = Math.round(x * 1000);
  // k / 1000 === x: x is the double nearest to k thousandths, so its shortest text is them.
  if (k / 1000 !== x || k > 1e15 || k < -1e15) return String(x);
  const whole = k < 0 ? -k : k;
  return (k < 0 ? '-' : '') + String(Math.floor(whole / 1000)) + THOUSANDTHS[whole % 1000];
}
