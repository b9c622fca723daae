import type { Knex } from 'knex';
import nodemailer from 'nodemailer';
import { oneLine } from './outbox';

/**
 * The outbox sender: claims due rows (pending, next_attempt_at ≤ now) with FOR UPDATE SKIP
 * LOCKED and a short lease, so two senders never take the same row, then delivers each over
 * SMTP with the row's own Message-ID (stable across retries). A temporary failure (4xx,
 * refused, timed out) is retried with exponential backoff and jitter; a permanent one (5xx)
 * is dead-lettered with its error kept in last_error. Alert and digest mail beyond the
 * organization's hourly cap is held (still pending, last_error says "held: …") until the
 * hour allows it; account mail (invitations, password resets) is never held.
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
/** A temporary failure that lasts this long (from the row's creation) becomes a dead letter. */
export const GIVE_UP_MS = 48 * HOUR_MS;

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
      if (row.org_id !== null && CAPPED_PURPOSES.has(row.purpose) && !(await cap.allow(row.org_id, row.mail_cap_per_hour ?? 60))) {
        await holdRow(opts.knex, row, await cap.reopensAt(row.org_id), row.mail_cap_per_hour ?? 60);
        report.held++;
        continue;
      }
      try {
        await transport.sendMail({
          from: opts.smtp.from, to: oneLine(row.to_address), subject: oneLine(row.subject), text: row.text_body, html: row.html_body,
          messageId: row.message_id, headers: { 'X-Duskwatch-Purpose': oneLine(row.purpose) }, ...(await threadOf(opts.knex, row)),
        });
        await opts.knex('email_outbox').where({ id: row.id }).update({ status: 'sent', sent_at: now, attempts: row.attempts + 1, last_error: null });
        report.sent++;
      } catch (error) {
        const verdict = classifySmtpError(error);
        const giveUp = verdict.kind === 'permanent' || now.getTime() - new Date(row.created_at).getTime() >= GIVE_UP_MS;
        await opts.knex('email_outbox').where({ id: row.id }).update({
          attempts: row.attempts + 1,
          last_error: (giveUp && verdict.kind === 'temporary' ? 'gave up after 48 h: ' : '') + verdict.summary,
          ...(giveUp ? { status: 'dead' } : { next_attempt_at: new Date(now.getTime() + retryDelaySeconds({ attempts: row.attempts + 1, random }) * 1000) }),
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

  async allow(orgId: number, capPerHour: number): Promise<boolean> {
    const times = await this.load(orgId);
    if (times.length >= capPerHour) return false;
    times.push(this.now);
    return true;
  }

  async reopensAt(orgId: number): Promise<Date> {
    return holdUntil({ sentTimes: await this.load(orgId), now: this.now });
  }
}

// ---- retry policy ----

/**
 * Which SMTP failures are worth retrying, and when. A 4xx reply, a refused or dropped
 * connection and a timeout are temporary; a 5xx reply (or a message the transport itself
 * refuses) is permanent. Unknown errors count as temporary: retrying loses nothing.
 */
export interface SmtpVerdict {
  kind: 'temporary' | 'permanent';
  /** The relay could not be reached at all (not a reply about this message). */
  connection: boolean;
  summary: string;
}

const CONNECTION_CODES = new Set(['ECONNECTION', 'ESOCKET', 'ETIMEDOUT', 'ECONNREFUSED', 'ECONNRESET', 'EDNS', 'EGREETING', 'ETLS', 'EPROTOCOL']);

export function classifySmtpError(error: unknown): SmtpVerdict {
  const e = (error ?? {}) as { code?: string; responseCode?: number; message?: string };
  const summary = `${e.responseCode ? `${e.responseCode} ` : ''}${e.code ? `${e.code}: ` : ''}${e.message ?? String(error)}`.slice(0, 1000);
  if (typeof e.responseCode === 'number' && e.responseCode >= 500) return { kind: 'permanent', connection: false, summary };
  if (typeof e.responseCode === 'number' && e.responseCode >= 400) return { kind: 'temporary', connection: false, summary };
  if (e.code && CONNECTION_CODES.has(e.code)) return { kind: 'temporary', connection: true, summary };
  if (e.code === 'EENVELOPE' || e.code === 'EMESSAGE') return { kind: 'permanent', connection: false, summary };
  return { kind: 'temporary', connection: false, summary };
}

const BASE_SECONDS = 30;
const MAX_SECONDS = 3600;

/**
 * Exponential backoff with "equal jitter": the n-th retry waits between half and all of
 * min(1 h, 30 s·2^(n−1)), so senders that failed together do not retry in lockstep.
 */
export function retryDelaySeconds({ attempts, random = Math.random }: { attempts: number; random?: () => number }): number {
  const ceiling = Math.min(MAX_SECONDS, BASE_SECONDS * 2 ** Math.max(0, attempts - 1));
  return ceiling / 2 + (ceiling / 2) * random();
}

/** A held message may go once the oldest send of the last hour has aged out of it. */
export function holdUntil({ sentTimes, now }: { sentTimes: Date[]; now: Date }): Date {
  const oldest = sentTimes.reduce((min, t) => Math.min(min, t.getTime()), Infinity);
  const reopens = Number.isFinite(oldest) ? oldest + 3_600_000 : now.getTime();
  return new Date(Math.max(reopens, now.getTime() + 60_000));
}
