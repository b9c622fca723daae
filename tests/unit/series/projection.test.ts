import { describe, expect, it } from 'vitest';
import { evaluateNode, modelBank, solveBurstFloor } from '@/lib/energy';
import { projectDischarge } from '@/lib/series/projection';
import { bank, converter, load, site } from '../energy/fixtures';

const spec = { bank, converter, load, site };
const at = new Date('2026-12-21T17:00:00Z');

describe('projectDischarge', () => {
  it('ends at the same recharge or brownout instant the margin model gives (cross-check, derived here)', () => {
    const endings = new Set<string>();
    for (const volts of [5.4, 2.0, 1.2, 0.9]) {
      const p = projectDischarge({ spec, volts, at });
      endings.add(p.ends_at);
      const e = evaluateNode({ ...spec, volts, at });
      expect(p.recharge_at).toBe(e.rechargeAt!.getTime() / 1000);
      if (e.brownoutAt) {
        expect(p.ends_at).toBe('brownout');
        expect(p.brownout_at! * 1000).toBeCloseTo(e.brownoutAt.getTime(), -2);
        expect(p.t.at(-1)!).toBeCloseTo(p.brownout_at!, 3);
      } else {
        expect(p.ends_at).toBe('recharge');
        expect(p.brownout_at).toBeNull();
        expect(p.t.at(-1)).toBeCloseTo(p.recharge_at!, 3);
      }
    }
    expect([...endings].sort()).toEqual(['brownout', 'recharge']); // both branches seen
  });

  it('starts at the latest reading and only falls, never below the burst floor', () => {
    const p = projectDischarge({ spec, volts: 2.0, at });
    const floor = solveBurstFloor({ bank: modelBank({ bank }), converter, load }).volts;
    expect(p.t[0]).toBe(at.getTime() / 1000);
    expect(p.volts[0]).toBe(2);
    for (let i = 1; i < p.volts.length; i++) {
      expect(p.t[i]).toBeGreaterThan(p.t[i - 1]);
      expect(p.volts[i]).toBeLessThanOrEqual(p.volts[i - 1]);
      expect(p.volts[i]).toBeGreaterThanOrEqual(floor - 1e-5);
    }
    // energy and reserve columns follow the volts: ½·C·V² with C = 3·100/2 = 150 F (derived here)
    expect(p.energy_joules[0]).toBeCloseTo(0.5 * 150 * 4, 3);
    expect(p.reserve_joules[0]).toBeCloseTo(0.5 * 150 * (4 - floor * floor), 2);
  });

  it('a bank already under the floor is browned out at once', () => {
    const p = projectDischarge({ spec, volts: 0.3, at });
    expect(p.ends_at).toBe('brownout');
    expect(p.brownout_at).toBe(at.getTime() / 1000);
    expect(p.t).toHaveLength(1);
  });
});
