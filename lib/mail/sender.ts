import type { Knex } from 'knex';
import nodemailer from 'nodemailer';
import { oneLine } from './outbox';
import { classifySmtpError, GIVE_UP_MS, holdUntil, nextAttemptAt, retryDelaySeconds } from './retry';

export { classifySmtpError, GIVE_UP_MS, holdUntil, retryDelaySeconds, type SmtpVerdict } from './retry';

/**
 * The outbox sender: claims due rows (pending, next_attempt_at ≤ now) with FOR UPDATE SKIP
 * LOCKED and a short lease, so two senders never take the same row, then delivers each over
 * SMTP with the row's own Message-ID (stable across retries). A temporary failure (4xx,
 * refused, timed out) is retried with exponential backoff and jitter (lib/mail/retry.ts); a
 * permanent one (5xx) is dead-lettered with its error kept in last_error. Alert and digest
 * mail beyond the organization's hourly cap (what was sent counts, not what was tried) is
 * held (still pending, last_error says "held: …") until the hour allows it; account mail
 * (invitations, password resets) is never held.
 */
export interface SmtpSettings {
  host: string;
  port: number;
  from: string;
  timeoutMs?: number;
}

export interface MailPassReport {
  claimed: number;
  sent: number;
  retrying: number;
  dead: number;
  held: number;
}

const LEASE_MS = 5 * 60_000;
const CAPPED_PURPOSES = new Set(['alert', 'digest']);
const HOUR_MS = 3_600_000;

interface OutboxRow {
  id: number;
  org_id: number | null;
  alert_id: number | null;
  purpose: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string;
  message_id: string;
  attempts: number;
  created_at: Date;
  mail_cap_per_hour: number | null;
}

export async function deliverDueMail(opts: { knex: Knex; now?: Date; smtp: SmtpSettings; batchSize?: number; random?: () => number }): Promise<MailPassReport> {
  const now = opts.now ?? new Date();
  const random = opts.random ?? Math.random;
  const rows = await claimDueRows(opts.knex, now, opts.batchSize ?? 50);
  const report: MailPassReport = { claimed: rows.length, sent: 0, retrying: 0, dead: 0, held: 0 };
  if (rows.length === 0) return report;
  const timeout = opts.smtp.timeoutMs ?? 10_000;
  const transport = nodemailer.createTransport({
    host: opts.smtp.host, port: opts.smtp.port, secure: false, ignoreTLS: true,
    connectionTimeout: timeout, greetingTimeout: timeout, socketTimeout: 6 * timeout,
  });
  const cap = new HourlyCap(opts.knex, now);
  try {
    for (let i = 0; i < rows.length; i++) {
      const row = rows[i];
      const cappedOrg = row.org_id !== null && CAPPED_PURPOSES.has(row.purpose) ? row.org_id : null;
      if (cappedOrg !== null && !(await cap.hasRoom(cappedOrg, row.mail_cap_per_hour ?? 60))) {
        await holdRow(opts.knex, row, await cap.reopensAt(cappedOrg), row.mail_cap_per_hour ?? 60);
        report.held++;
        continue;
      }
      try {
        await transport.sendMail({
          from: opts.smtp.from, to: oneLine(row.to_address), subject: oneLine(row.subject), text: row.text_body, html: row.html_body,
          messageId: row.message_id, headers: { 'X-Duskwatch-Purpose': oneLine(row.purpose) }, ...(await threadOf(opts.knex, row)),
        });
        // Only a message the relay took counts against the cap: a failed try sent nothing.
        if (cappedOrg !== null) cap.record(cappedOrg);
        await opts.knex('email_outbox').where({ id: row.id }).update({ status: 'sent', sent_at: now, attempts: row.attempts + 1, last_error: null });
        report.sent++;
      } catch (error) {
        const verdict = classifySmtpError(error);
        const giveUp = verdict.kind === 'permanent' || now.getTime() - new Date(row.created_at).getTime() >= GIVE_UP_MS;
        await opts.knex('email_outbox').where({ id: row.id }).update({
          attempts: row.attempts + 1,
          last_error: (giveUp && verdict.kind === 'temporary' ? 'gave up after 48 h: ' : '') + verdict.summary,
          ...(giveUp ? { status: 'dead' } : { next_attempt_at: nextAttemptAt({
            now, createdAt: new Date(row.created_at), delaySeconds: retryDelaySeconds({ attempts: row.attempts + 1, random, relayDown: verdict.connection }),
          }) }),
        });
        if (giveUp) report.dead++;
        else report.retrying++;
        // The relay is unreachable: the other claimed rows wait for the next pass, untouched.
        if (verdict.connection) {
          await releaseRows(opts.knex, rows.slice(i + 1), now);
          break;
        }
      }
    }
  } finally {
    transport.close();
  }
  return report;
}

async function claimDueRows(knex: Knex, now: Date, limit: number): Promise<OutboxRow[]> {
  return knex.transaction(async (trx): Promise<OutboxRow[]> => {
    const due = await trx('email_outbox').where('status', 'pending').andWhere('next_attempt_at', '<=', now)
      .orderBy('next_attempt_at').orderBy('id').limit(limit).forUpdate().skipLocked().pluck('id');
    if (due.length === 0) return [];
    await trx('email_outbox').whereIn('id', due).update({ next_attempt_at: new Date(now.getTime() + LEASE_MS) });
    return await trx('email_outbox as e').leftJoin('organizations as o', 'o.id', 'e.org_id').whereIn('e.id', due).orderBy('e.id')
      .select('e.*', 'o.mail_cap_per_hour');
  });
}

async function releaseRows(knex: Knex, rows: OutboxRow[], now: Date) {
  if (rows.length) await knex('email_outbox').whereIn('id', rows.map((r) => r.id)).andWhere('status', 'pending').update({ next_attempt_at: now });
}

async function holdRow(knex: Knex, row: OutboxRow, until: Date, capPerHour: number) {
  await knex('email_outbox').where({ id: row.id }).update({
    next_attempt_at: until,
    last_error: `held: the organization's cap of ${capPerHour} e-mails an hour is reached; goes out from ${until.toISOString()}`,
  });
}

/** A reminder threads under the first e-mail of the same alert to the same person. */
async function threadOf(knex: Knex, row: OutboxRow): Promise<{ inReplyTo?: string; references?: string }> {
  if (row.alert_id === null) return {};
  const first = await knex('email_outbox').where({ alert_id: row.alert_id, to_address: row.to_address }).orderBy('id').first('message_id');
  return first && first.message_id !== row.message_id ? { inReplyTo: first.message_id, references: first.message_id } : {};
}

/** Alert and digest mail sent per organization in the hour up to `now`, counted once a pass. */
class HourlyCap {
  private sent = new Map<number, Date[]>();
  constructor(private knex: Knex, private now: Date) {}

  private async load(orgId: number): Promise<Date[]> {
    if (!this.sent.has(orgId)) {
      const since = new Date(this.now.getTime() - HOUR_MS);
      const times = await this.knex('email_outbox').where({ org_id: orgId, status: 'sent' }).whereIn('purpose', [...CAPPED_PURPOSES])
        .andWhere('sent_at', '>', since).andWhere('sent_at', '<=', this.now).orderBy('sent_at').pluck('sent_at');
      this.sent.set(orgId, times.map((t: Date | string) => new Date(t)));
    }
    return this.sent.get(orgId)!;
  }

  async hasRoom(orgId: number, capPerHour: number): Promise<boolean> {
    return (await this.load(orgId)).length < capPerHour;
  }

  /** After hasRoom (which loaded the organization's sends), a message of this pass went out. */
  record(orgId: number) {
    this.sent.get(orgId)?.push(this.now);
  }

  async reopensAt(orgId: number): Promise<Date> {
    return holdUntil({ sentTimes: await this.load(orgId), now: this.now });
  }
}
