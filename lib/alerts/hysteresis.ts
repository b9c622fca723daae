import { RESOLVE_AFTER_CLEAR_PASSES, type AlertKind, type AlertStatus } from './kinds';
import type { Verdict } from './rules';

/** What one pass does to one node+kind, given the unresolved alert (if any) and the verdict. */
export type AlertStep =
  | { action: 'none' }
  | { action: 'open' }
  | { action: 'refresh'; remind: boolean }
  | { action: 'count_clear'; clearPasses: number }
  | { action: 'resolve' }
  | { action: 'hold' };

export interface UnresolvedAlert {
  kind: AlertKind;
  status: Exclude<AlertStatus, 'resolved'>;
  clearPasses: number;
  lastNotifiedAt: Date | null;
}

export function stepAlert({
  existing,
  verdict,
  now,
  resendShortHours,
}: {
  existing: UnresolvedAlert | null;
  verdict: Verdict;
  now: Date;
  resendShortHours: number;
}): AlertStep {
  if (!existing) return verdict.active ? { action: 'open' } : { action: 'none' };
  if (verdict.active) return { action: 'refresh', remind: reminderDue({ existing, now, resendShortHours }) };
  if (verdict.clear) {
    const clearPasses = existing.clearPasses + 1;
    return clearPasses >= RESOLVE_AFTER_CLEAR_PASSES ? { action: 'resolve' } : { action: 'count_clear', clearPasses };
  }
  return { action: 'hold' };
}

/** Only an unacknowledged short alert is re-sent; acknowledging stops reminders. */
export function reminderDue({ existing, now, resendShortHours }: { existing: UnresolvedAlert; now: Date; resendShortHours: number }): boolean {
  if (existing.kind !== 'reserve_short' || existing.status !== 'open' || resendShortHours <= 0) return false;
  if (!existing.lastNotifiedAt) return true;
  return now.getTime() - existing.lastNotifiedAt.getTime() >= resendShortHours * 3_600_000;
}
