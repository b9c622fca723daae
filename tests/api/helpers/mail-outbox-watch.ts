// What the mail-outage test checks after every runner tick: no e-mail dead, tries bounded, no
// retry or hold further ahead than the policy allows, and a hold only when the organization
// really sent its cap in the hour up to now (common practice: a rate cap counts what was sent).
import { expect } from 'vitest';

export interface OutboxRow {
  id: number; org_id: number; alert_id: number; to_address: string; message_id: string; status: string; attempts: number;
  next_attempt_at: Date; last_error: string | null; sent_at: Date | null; created_at: Date;
}

const HOUR_MS = 3_600_000;
/** lib/mail/sender.ts holds mail until the oldest send of the last hour ages out: at most 1 h ahead. */
const HOLD_CAP_MS = HOUR_MS;

export function watchOutbox(opts: { rows: () => Promise<OutboxRow[]>; caps: Map<number, number>; retryCapMs: number; maxAttempts: number }) {
  const lastError = new Map<number, string | null>();
  const everHeld = new Set<number>();
  const check = async (now: Date) => {
    const rows = await opts.rows();
    for (const row of rows) {
      const where = `row ${row.id} at ${now.toISOString()}`;
      expect(row.status, where).not.toBe('dead');
      expect(row.attempts, where).toBeLessThanOrEqual(opts.maxAttempts);
      const held = row.last_error?.startsWith('held') ?? false;
      const ahead = new Date(row.next_attempt_at).getTime() - now.getTime();
      if (row.status === 'pending') expect(ahead, where).toBeLessThanOrEqual(held ? HOLD_CAP_MS : opts.retryCapMs);
      const newlyHeld = held && row.last_error !== lastError.get(row.id);
      lastError.set(row.id, row.last_error);
      if (!newlyHeld) continue;
      everHeld.add(row.id);
      const sentInHour = rows.filter((r) => r.org_id === row.org_id && r.sent_at && now.getTime() - new Date(r.sent_at).getTime() < HOUR_MS);
      expect(sentInHour.length, `${where}: held with fewer sent than the cap`).toBeGreaterThanOrEqual(opts.caps.get(row.org_id)!);
    }
  };
  return { check, everHeld };
}
