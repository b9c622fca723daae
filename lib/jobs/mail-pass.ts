import type { Knex } from 'knex';
import { deliverDueMail, type MailPassReport, type SmtpSettings } from '../mail/sender';
import { MAIL_PASS_LOCK, withNamedLock } from './named-lock';

/**
 * One mail pass under its own named lock: one sender at a time keeps the hourly cap exact
 * (SKIP LOCKED alone already keeps two senders off the same row).
 */
export async function runMailPass(opts: { knex: Knex; now?: Date; smtp: SmtpSettings; random?: () => number }): Promise<MailPassReport & { ran: boolean }> {
  const outcome = await withNamedLock({ knex: opts.knex, name: MAIL_PASS_LOCK }, () => deliverDueMail(opts));
  return outcome.ran ? { ran: true, ...outcome.value } : { ran: false, claimed: 0, sent: 0, retrying: 0, dead: 0, held: 0 };
}
