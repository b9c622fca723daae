import { describe, expect, it } from 'vitest';
import { ALERT_KINDS as MIGRATION_KINDS } from '@/db/migrations/20261203000007_alert_dark_through_day';
import { ALERT_KINDS } from '@/lib/alerts/kinds';
import { evaluateAlertRules, type RuleInput } from '@/lib/alerts/rules';
import { MAX_VOLTS, statusWith } from './fixtures';

const base = (over: Partial<RuleInput> = {}): RuleInput => ({
  status: statusWith({}), thresholds: { steady: 1.5, thin: 1.0 }, alertOnThin: false, maxVolts: MAX_VOLTS, night: null, day: null, missedDay: null, ...over,
});

describe('alert kinds', () => {
  it('are the kinds the database enum accepts', () => {
    expect([...ALERT_KINDS]).toEqual([...MIGRATION_KINDS]);
  });
});

describe('alert rules (the thresholds of DESIGN.md §4 and issue 6)', () => {
  it('a short node is reserve_short; it clears only at margin ≥ threshold + 0.1', () => {
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'short', margin: 0.7 }) })).reserve_short).toEqual({ active: true, clear: false });
    // 1.05 is thin, above 1 but inside the band: neither active nor clear (held).
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'thin', margin: 1.05 }) })).reserve_short).toEqual({ active: false, clear: false });
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'thin', margin: 1.1 }) })).reserve_short).toEqual({ active: false, clear: true });
  });

  it('a silent or new node keeps the short alert as it is (no fresh margin to judge by)', () => {
    for (const state of ['silent', 'new'] as const) {
      expect(evaluateAlertRules(base({ status: statusWith({ state, margin: 3 }) })).reserve_short).toEqual({ active: false, clear: false });
    }
  });

  it('a dark node clears its short and thin alerts: the brownout happened and the dark alert speaks for it', () => {
    const dark = evaluateAlertRules(base({ alertOnThin: true, status: statusWith({ state: 'dark', margin: 0.2 }) }));
    expect(dark.reserve_short).toEqual({ active: false, clear: true });
    expect(dark.reserve_thin).toEqual({ active: false, clear: true });
    expect(dark.node_dark.active).toBe(true);
  });

  it('reserve_thin only when the organization asks for it; opened thin, kept while short, cleared at steady + 0.1', () => {
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'thin', margin: 1.2 }) })).reserve_thin.active).toBe(false);
    const on = { alertOnThin: true };
    expect(evaluateAlertRules(base({ ...on, status: statusWith({ state: 'thin', margin: 1.2 }) })).reserve_thin).toEqual({ active: true, clear: false });
    expect(evaluateAlertRules(base({ ...on, status: statusWith({ state: 'short', margin: 0.5 }) })).reserve_thin).toEqual({ active: false, clear: false });
    expect(evaluateAlertRules(base({ ...on, status: statusWith({ state: 'steady', margin: 1.55 }) })).reserve_thin).toEqual({ active: false, clear: false });
    expect(evaluateAlertRules(base({ ...on, status: statusWith({ state: 'steady', margin: 1.6 }) })).reserve_thin).toEqual({ active: false, clear: true });
  });

  it('dark and silent follow the node state and clear once it reports again', () => {
    const dark = evaluateAlertRules(base({ status: statusWith({ state: 'dark' }) }));
    expect(dark.node_dark).toEqual({ active: true, clear: false });
    expect(dark.node_silent).toEqual({ active: false, clear: false });
    const back = evaluateAlertRules(base({ status: statusWith({ state: 'steady' }) }));
    expect(back.node_dark.clear && back.node_silent.clear).toBe(true);
  });

  it('a dark node that missed a whole day of sun escalates; it clears with the dark alert once it reports', () => {
    const missed = { startAt: new Date('2026-06-21T02:32:00Z'), endAt: new Date('2026-06-21T17:40:00Z') };
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'dark' }), missedDay: missed })).dark_through_day).toEqual({ active: true, clear: false });
    // dark, but the day is not over: only the dark alert
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'dark' }), missedDay: null })).dark_through_day).toEqual({ active: false, clear: false });
    // silent (healthy bank) through a day is a link problem, not this one
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'silent' }), missedDay: missed })).dark_through_day.active).toBe(false);
    expect(evaluateAlertRules(base({ status: statusWith({ state: 'steady' }), missedDay: null })).dark_through_day).toEqual({ active: false, clear: true });
  });

  it('draw anomaly above 1.3× the modelled draw (issue 6), clear at or below 1.2×', () => {
    const night = (ratio: number) => ({ startAt: new Date(0), endAt: new Date(1), measuredWatts: ratio * 0.002, modelledWatts: 0.002, ratio, points: 50, r2: 0.99 });
    expect(evaluateAlertRules(base({ night: night(1.31) })).draw_anomaly).toEqual({ active: true, clear: false });
    expect(evaluateAlertRules(base({ night: night(1.3) })).draw_anomaly).toEqual({ active: false, clear: false });
    expect(evaluateAlertRules(base({ night: night(1.2) })).draw_anomaly).toEqual({ active: false, clear: true });
    expect(evaluateAlertRules(base({ night: null })).draw_anomaly).toEqual({ active: false, clear: false });
  });

  it('over-voltage above 98 % of ns·Vr (issue 6): 2 × 2.7 V → 5.292 V (derived here)', () => {
    expect(evaluateAlertRules(base({ status: statusWith({ volts: 5.3 }) })).over_voltage.active).toBe(true);
    expect(evaluateAlertRules(base({ status: statusWith({ volts: 5.28 }) })).over_voltage).toEqual({ active: false, clear: false });
    expect(evaluateAlertRules(base({ status: statusWith({ volts: 5.18 }) })).over_voltage).toEqual({ active: false, clear: true });
  });

  it('not charging needs a clear day with no gain and a bank that was not already full', () => {
    const day = (over: object) => ({ startAt: new Date(0), endAt: new Date(1), clearSky: true, skyEvidence: 'panel_volts' as const, gainJoules: 0, gained: false, nearFull: false, ...over });
    expect(evaluateAlertRules(base({ day: day({}) })).not_charging).toEqual({ active: true, clear: false });
    expect(evaluateAlertRules(base({ day: day({ clearSky: false }) })).not_charging).toEqual({ active: false, clear: false });
    expect(evaluateAlertRules(base({ day: day({ nearFull: true }) })).not_charging).toEqual({ active: false, clear: true });
    expect(evaluateAlertRules(base({ day: day({ gained: true, gainJoules: 20 }) })).not_charging).toEqual({ active: false, clear: true });
  });
});
