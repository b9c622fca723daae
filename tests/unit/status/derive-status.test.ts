import { describe, expect, it } from 'vitest';
import { evaluateNode } from '@/lib/energy';
import { deriveNodeStatus, MISSED_REPORT_INTERVALS, QUIET_INTERVALS } from '@/lib/status/derive-status';
import { bank, converter, load, site } from '../energy/fixtures';

// The dark/silent rules are our own (DESIGN.md §4); the figures come from the model itself.
const spec = { bank, converter, load, site };
const thresholds = { steady: 1.5, thin: 1 };
const t = new Date('2026-12-21T17:00:00Z');
const at = (seconds: number) => new Date(t.getTime() + seconds * 1000);

describe('deriveNodeStatus: quiet nodes', () => {
  // 0.95 V at 17:00 on the longest night: projected to brown out in under two hours; the
  // node was last told to report hourly.
  const advised = 3600;
  const e = evaluateNode({ ...spec, volts: 0.95, at: t, thresholds });
  const expected = Math.max(load.intervalSeconds, advised, e.nextReportSeconds);
  const brownoutSeconds = (e.brownoutAt!.getTime() - t.getTime()) / 1000;
  const status = (seconds: number) =>
    deriveNodeStatus({ spec, latest: { t, volts: 0.95, panelVolts: null }, now: at(seconds), thresholds, lastAdvisedIntervalSeconds: advised });

  it('the case is a short node whose brownout comes before three quiet intervals', () => {
    expect(e.state).toBe('short');
    expect(brownoutSeconds).toBeGreaterThan(0);
    expect(brownoutSeconds).toBeLessThan(QUIET_INTERVALS * expected - 120);
  });

  it('stays short while its brownout is still ahead', () => {
    expect(status(brownoutSeconds - 60).state).toBe('short');
  });

  it('turns dark once its brownout has passed and a report is missed, before three quiet intervals', () => {
    const when = Math.max(brownoutSeconds, MISSED_REPORT_INTERVALS * expected) + 60;
    expect(when).toBeLessThan(QUIET_INTERVALS * expected);
    expect(status(when).state).toBe('dark');
  });

  it('a healthy node quiet for less than three intervals keeps its state; past them it is silent', () => {
    const full = deriveNodeStatus({ spec, latest: { t, volts: 5.0, panelVolts: null }, now: at(2 * load.intervalSeconds), thresholds });
    expect(full.state).toBe('steady');
    const fullE = evaluateNode({ ...spec, volts: 5.0, at: t, thresholds });
    const fullExpected = Math.max(load.intervalSeconds, fullE.nextReportSeconds);
    const later = deriveNodeStatus({ spec, latest: { t, volts: 5.0, panelVolts: null }, now: at(QUIET_INTERVALS * fullExpected + 60), thresholds });
    expect(later.state).toBe('silent');
  });
});
