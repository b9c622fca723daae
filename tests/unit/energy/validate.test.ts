import { describe, expect, it } from 'vitest';
import { checkNodeSpecs } from '@/lib/energy';
import { bank, converter, load, site } from './fixtures';

describe('checkNodeSpecs', () => {
  it('accepts the fixture node', () => {
    expect(checkNodeSpecs({ bank, converter, load, site })).toEqual([]);
  });

  it('names each bad field: cutoff above the bank maximum, negative farads, a bad efficiency point', () => {
    const problems = checkNodeSpecs({
      bank: { ...bank, cellFarads: -1 },
      converter: { ...converter, cutoffVolts: 6, startVolts: 6.5, efficiency: [[1, 0.8], [2, 1.3]] },
      load: { ...load, maxIntervalSeconds: 60 },
      site,
    });
    expect(problems.map((p) => p.path.join('.'))).toEqual([
      'bank.cellFarads',
      'converter.cutoffVolts',
      'converter.startVolts',
      'converter.efficiency.1.1',
      'load.maxIntervalSeconds',
    ]);
    expect(problems[1].message).toContain('5.4 V');
  });
});
