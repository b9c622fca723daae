import { BOOST_3V3, CELL_100F, CELL_25F, CELL_50F, CHARGER, makeBank, makeLoad, makePanel } from '../fleet/demo-parts';
import { SimNode } from '../physics/node';
import { createRandom, hashSeed } from '../physics/prng';
import type { SimNodeSpec } from '../physics/types';
import { createWeather } from '../physics/weather';

// A fleet for load tests: one site, N nodes with banks, panels and cadences varied from a seed.
// Invented parts (simulator/fleet/demo-parts.ts), so every node is a plausible one.

const CELLS = [CELL_25F, CELL_50F, CELL_100F];
const INTERVALS_SECONDS = [300, 600, 900];

export function buildGenericSpec({ index, seed, latDeg, lonDeg }: { index: number; seed: number; latDeg: number; lonDeg: number }): SimNodeSpec {
  const random = createRandom(hashSeed(seed, index, 17));
  const pick = <T>(list: T[]) => list[Math.floor(random() * list.length)];
  const cell = pick(CELLS);
  return {
    slug: `load-${index + 1}`,
    site: { latDeg, lonDeg, timeZone: 'UTC', meanTempC: 2, tempSwingC: 4 },
    bank: makeBank({ cell, parallel: random() < 0.3 ? 2 : 1 }),
    converter: BOOST_3V3,
    load: makeLoad({ intervalSeconds: pick(INTERVALS_SECONDS) }),
    panel: makePanel(pick([1, 2, 3])),
    charger: CHARGER,
    faults: { capacitanceFactor: 0.7 + 0.3 * random(), leakageFactor: 1 + 4 * random(), shadingFactor: 0.5 + 0.5 * random() },
    rssiDbm: Math.round(-55 - 30 * random()),
  };
}

/** N nodes at `startAt`, all under one sky, each bank part-charged. */
export function buildGenericNodes({ count, seed, latDeg, lonDeg, startAt }: {
  count: number; seed: number; latDeg: number; lonDeg: number; startAt: Date;
}): SimNode[] {
  const weather = createWeather({ seed: hashSeed(seed, 5), lonDeg });
  return Array.from({ length: count }, (_, index) => {
    const spec = buildGenericSpec({ index, seed, latDeg, lonDeg });
    const chargeVolts = spec.bank.cellsSeries * spec.bank.cellRatedVolts * 0.98;
    const random = createRandom(hashSeed(seed, index, 29));
    return new SimNode(spec, { seed: hashSeed(seed, index), startAt, initialVolts: (0.55 + 0.4 * random()) * chargeVolts, weather });
  });
}
