import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';

/**
 * The transactional outbox: a message is a row written in the same transaction as whatever
 * caused it, and the sender (job runner) delivers it later, retrying as needed. Header values
 * are flattened to one line here so that no name with a line break can inject a header.
 */
export interface OutboxMessage {
  orgId: number | null;
  alertId?: number | null;
  purpose: 'alert' | 'digest' | 'invitation' | 'password_reset';
  to: string;
  subject: string;
  text: string;
  html: string;
}

export function oneLine(value: string): string {
  return value.replace(/[\r\n\u2028\u2029]+/g, ' ').replace(/[\u0000-\u001f\u007f]/g, '').trim();
}

export async function enqueueMail(trx: Knex | Knex.Transaction, message: OutboxMessage): Promise<number> {
  const [id] = await trx('email_outbox').insert({
    org_id: message.orgId,
    alert_id: message.alertId ?? null,
    purpose: message.purpose,
    to_address: oneLine(message.to).slice(0, 254),
    subject: oneLine(message.subject).slice(0, 300),
    text_body: message.text,
    html_body: message.html,
    message_id: `<${randomUUID()}@duskwatch.local>`,
  });
  return id;
}

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
