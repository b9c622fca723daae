import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import type { Knex } from 'knex';
import type { AlertKind } from '../alerts/kinds';
import { deliveryFor } from '../alerts/recipients';
import { insertDigestMail, listAlertsOpenedBetween, listDigestOrgs, listOrgContacts, listOrgSubscriptions, outboxHasMessage } from '../db/queries/subscriptions';
import { oneLine } from '../mail/outbox';
import { buildDigestMail, type DigestItem } from '../mail/templates/digest-mail';

/**
 * The daily digest: from 07:00 in the zone of the organization's first site, each member with
 * digest subscriptions gets one mail listing the matching alerts opened in the 24 hours before
 * 07:00. Nothing to report, no mail. Idempotent through the digest's Message-ID.
 */
export const DIGEST_LOCAL_HOUR = 7;

export async function runDigestPass({ knex, now = new Date(), appUrl }: { knex: Knex; now?: Date; appUrl: string }): Promise<number> {
  let written = 0;
  for (const org of await listDigestOrgs(knex)) {
    const local = new TZDate(now.getTime(), org.timeZone);
    if (local.getHours() < DIGEST_LOCAL_HOUR) continue;
    const end = new Date(new TZDate(local.getFullYear(), local.getMonth(), local.getDate(), DIGEST_LOCAL_HOUR, 0, 0, org.timeZone).getTime());
    const start = new Date(end.getTime() - 86_400_000);
    const day = format(local, 'yyyy-MM-dd');
    const [members, subscriptions, alerts] = await Promise.all([
      listOrgContacts(knex, org.orgId), listOrgSubscriptions(knex, org.orgId), listAlertsOpenedBetween(knex, org.orgId, start, end),
    ]);
    for (const member of members) {
      const messageId = `<digest-${member.membershipId}-${day}@duskwatch.local>`;
      if (await outboxHasMessage(knex, messageId)) continue;
      const items: DigestItem[] = alerts
        .filter((a) => deliveryFor({ member, subscriptions, siteId: a.site_id, kind: a.kind as AlertKind }) === 'digest')
        .map((a) => {
          const detail = (typeof a.detail === 'string' ? JSON.parse(a.detail) : a.detail) ?? {};
          return {
            alertId: a.id, kind: a.kind, status: a.status, nodeId: a.node_id, nodeName: a.node_name, siteName: a.site_name, timeZone: a.time_zone,
            openedAt: new Date(a.opened_at), margin: detail.margin ?? null, brownoutAt: detail.brownout_at ?? null,
          };
        });
      if (items.length === 0) continue;
      const mail = buildDigestMail({ orgName: org.orgName, day, items, appUrl });
      const inserted = await insertDigestMail(knex, {
        orgId: org.orgId, to: oneLine(member.email), ...mail, now, messageId,
      });
      if (inserted) written++;
    }
  }
  return written;
}
