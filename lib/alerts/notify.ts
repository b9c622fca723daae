import type { Knex } from 'knex';
import { buildAlertMail, type AlertMailInput } from '../mail/templates/alert-mail';
import { enqueueMail } from '../mail/outbox';
import { chooseRecipients, type MemberContact, type SubscriptionRow } from './recipients';

/**
 * Queues the e-mails of one alert event (opened, or a reminder) in the caller's transaction, so
 * the alert and its mail commit or vanish together. Rows are due at the pass's `now`, not at
 * the database clock, so a pass run for a given instant behaves the same in tests and in use.
 */
export interface OrgAudience {
  members: MemberContact[];
  subscriptions: SubscriptionRow[];
}

export async function enqueueAlertMails(
  trx: Knex.Transaction,
  opts: { orgId: number; alertId: number; siteId: number; audience: OrgAudience; mail: AlertMailInput; now: Date },
): Promise<number> {
  const recipients = chooseRecipients({ ...opts.audience, siteId: opts.siteId, kind: opts.mail.kind, delivery: 'immediate' });
  if (recipients.length === 0) return 0;
  const message = buildAlertMail(opts.mail);
  for (const person of recipients) {
    const id = await enqueueMail(trx, { orgId: opts.orgId, alertId: opts.alertId, purpose: 'alert', to: person.email, ...message });
    await trx('email_outbox').where({ id }).update({ created_at: opts.now, next_attempt_at: opts.now });
  }
  return recipients.length;
}
