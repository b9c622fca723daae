import { hashSeed, randomAt } from './prng';

// Clouds: a Markov chain over days (clear / broken / overcast) so spells last several days,
// plus an hourly factor drawn within the day's kind. Deterministic by seed, day and hour.

export type SkyKind = 'clear' | 'broken' | 'overcast';
const KINDS: SkyKind[] = ['clear', 'broken', 'overcast'];

// Rows: today's kind; columns: tomorrow's. Strong diagonals give multi-day spells (invented,
// loosely shaped after a winter valley climate).
const TRANSITIONS: number[][] = [
  [0.6, 0.3, 0.1],
  [0.25, 0.45, 0.3],
  [0.1, 0.25, 0.65],
];

const DAY_MS = 86_400_000;
// The chain starts from a fixed day so any query order gives the same sky.
const CHAIN_ORIGIN_DAY = Math.floor(Date.UTC(2020, 0, 1) / DAY_MS);

export interface Weather {
  getSkyKind(at: Date): SkyKind;
  /** Fraction of clear-sky irradiance reaching the ground, 0..1. */
  getCloudFactor(at: Date): number;
}

/** A stretch of sky imposed by a scenario (e.g. the demo's cloudy spell). */
export interface ForcedSpell { from: Date; to: Date; kind: SkyKind }

export function createWeather({ seed, lonDeg = 0, forcedSpells = [] }: { seed: number; lonDeg?: number; forcedSpells?: ForcedSpell[] }): Weather {
  const kinds: number[] = [0];
  // Days counted in local solar time so the weather changes near midnight, not at noon.
  const offsetMs = (lonDeg / 360) * DAY_MS;
  const dayIndexOf = (at: Date) => Math.floor((at.getTime() + offsetMs) / DAY_MS) - CHAIN_ORIGIN_DAY;

  function kindIndexOfDay(day: number): number {
    if (day < 0) return 0;
    while (kinds.length <= day) {
      const d = kinds.length;
      const row = TRANSITIONS[kinds[d - 1]];
      const u = randomAt(seed, d, 17);
      kinds.push(u < row[0] ? 0 : u < row[0] + row[1] ? 1 : 2);
    }
    return kinds[day];
  }

  function kindIndexAt(at: Date): number {
    const spell = forcedSpells.find((f) => at >= f.from && at < f.to);
    return spell ? KINDS.indexOf(spell.kind) : kindIndexOfDay(dayIndexOf(at));
  }

  function getCloudFactor(at: Date): number {
    const kind = kindIndexAt(at);
    const hour = Math.floor(at.getTime() / 3_600_000);
    const u = randomAt(hashSeed(seed, 99), hour);
    if (kind === 0) return 0.9 + 0.1 * u;
    if (kind === 1) return 0.3 + 0.6 * u;
    return 0.12 + 0.08 * u;
  }

  return { getSkyKind: (at) => KINDS[kindIndexAt(at)], getCloudFactor };
}
