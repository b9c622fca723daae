import type { SimNodeSpec } from '../../../simulator/physics/types';

// A plain test node: invented values, chosen only to make the arithmetic easy to follow.
export function makeTestSpec(overrides: Partial<SimNodeSpec> = {}): SimNodeSpec {
  return {
    slug: 'test-node',
    site: { latDeg: 47.1, lonDeg: -120.5, timeZone: 'America/Los_Angeles' },
    bank: { cellsSeries: 2, cellsParallel: 1, cellFarads: 50, cellRatedVolts: 2.7, cellEsrOhms: 0.0001, cellLeakageAmps: 0 },
    converter: { startVolts: 0.8, cutoffVolts: 0.5, outputVolts: 3.3, efficiency: 0.8, inputLimitAmps: 5 },
    load: { sleepAmps: 10e-6, awakeSeconds: 2, awakeAmps: 0.08, burstSeconds: 1, burstAmps: 0.22, intervalSeconds: 600, maxIntervalSeconds: 3600 },
    panel: { ratedWatts: 2, nominalVolts: 6, openCircuitVolts: 6.5 },
    charger: { efficiency: 0.8, chargeLimitAmps: 0.5 },
    ...overrides,
  };
}
