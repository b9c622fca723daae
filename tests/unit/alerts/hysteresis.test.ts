import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { stepAlert, type UnresolvedAlert } from '@/lib/alerts/hysteresis';
import { evaluateAlertRules } from '@/lib/alerts/rules';
import { stateFromMargin } from '@/lib/energy';
import { MAX_VOLTS, statusWith } from './fixtures';

const now = new Date('2026-11-20T04:00:00Z');
const open = (over: Partial<UnresolvedAlert> = {}): UnresolvedAlert => ({ kind: 'reserve_short', status: 'open', clearPasses: 0, lastNotifiedAt: now, ...over });

describe('stepping one alert per pass', () => {
  it('opens on an active verdict, resolves after two consecutive clear passes', () => {
    expect(stepAlert({ existing: null, verdict: { active: true, clear: false }, now, resendShortHours: 6 })).toEqual({ action: 'open' });
    expect(stepAlert({ existing: null, verdict: { active: false, clear: true }, now, resendShortHours: 6 })).toEqual({ action: 'none' });
    expect(stepAlert({ existing: open(), verdict: { active: false, clear: true }, now, resendShortHours: 6 })).toEqual({ action: 'count_clear', clearPasses: 1 });
    expect(stepAlert({ existing: open({ clearPasses: 1 }), verdict: { active: false, clear: true }, now, resendShortHours: 6 })).toEqual({ action: 'resolve' });
    expect(stepAlert({ existing: open({ clearPasses: 1 }), verdict: { active: false, clear: false }, now, resendShortHours: 6 })).toEqual({ action: 'hold' });
  });

  it('re-sends an unacknowledged short alert after resend_short_hours, never an acknowledged one', () => {
    const sixHoursAgo = new Date(now.getTime() - 6 * 3_600_000);
    const active = { active: true, clear: false };
    expect(stepAlert({ existing: open({ lastNotifiedAt: new Date(sixHoursAgo.getTime() + 1000) }), verdict: active, now, resendShortHours: 6 })).toEqual({ action: 'refresh', remind: false });
    expect(stepAlert({ existing: open({ lastNotifiedAt: sixHoursAgo }), verdict: active, now, resendShortHours: 6 })).toEqual({ action: 'refresh', remind: true });
    expect(stepAlert({ existing: open({ lastNotifiedAt: sixHoursAgo, status: 'acknowledged' }), verdict: active, now, resendShortHours: 6 })).toEqual({ action: 'refresh', remind: false });
    expect(stepAlert({ existing: open({ lastNotifiedAt: sixHoursAgo, kind: 'node_dark' }), verdict: active, now, resendShortHours: 6 })).toEqual({ action: 'refresh', remind: false });
  });

  it('a margin hovering around 1 (0.9 … 1.09) never resolves and never re-opens (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.9, max: 1.0999, noNaN: true }), { minLength: 1, maxLength: 60 }), (margins) => {
        let existing: UnresolvedAlert | null = null;
        let opens = 0;
        for (const margin of margins) {
          const state = stateFromMargin({ margin, thresholds: { steady: 1.5, thin: 1.0 } });
          const verdict = evaluateAlertRules({ status: statusWith({ state, margin }), thresholds: { steady: 1.5, thin: 1 }, alertOnThin: false, maxVolts: MAX_VOLTS, night: null, day: null, missedDay: null }).reserve_short;
          const step = stepAlert({ existing, verdict, now, resendShortHours: 6 });
          if (step.action === 'open') { opens++; existing = open(); }
          if (step.action === 'resolve') return false;
          if (existing && step.action === 'count_clear') existing = { ...existing, clearPasses: step.clearPasses };
          if (existing && step.action === 'hold') existing = { ...existing, clearPasses: 0 };
        }
        return opens <= 1;
      }),
    );
  });
});
