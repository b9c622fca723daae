import { KIND_INFO, type AlertKind } from '../../alerts/kinds';
import { escapeHtml, oneLine } from '../outbox';
import { formatMargin, localTime, nodeLink } from './parts';

/** The daily digest of one member: every alert of their digest subscriptions opened that day. */
export interface DigestItem {
  alertId: number;
  kind: AlertKind;
  status: string;
  nodeId: number;
  nodeName: string;
  siteName: string;
  timeZone: string;
  openedAt: Date;
  margin: number | null;
  brownoutAt: string | null;
}

export function buildDigestMail({ orgName, day, items, appUrl }: { orgName: string; day: string; items: DigestItem[]; appUrl: string }) {
  const subject = oneLine(`Duskwatch digest for ${orgName}, ${day}: ${items.length} alert${items.length === 1 ? '' : 's'}`);
  const line = (i: DigestItem) => {
    const brownout = localTime(i.brownoutAt, i.timeZone);
    return `${oneLine(i.nodeName)} at ${oneLine(i.siteName)}: ${KIND_INFO[i.kind].title} (opened ${localTime(i.openedAt, i.timeZone)}, margin ${formatMargin(i.margin)}${brownout ? `, brownout projected ${brownout}` : ''}; now ${i.status})`;
  };
  const text = [
    `Alerts opened in the 24 hours up to this morning, ${day}:`,
    '',
    ...items.map((i) => `- ${line(i)}\n  ${nodeLink(appUrl, i.nodeId)}`),
    '',
    `All alerts: ${appUrl.replace(/\/+$/, '')}/alerts`,
  ].join('\n');
  const html = [
    `<p>Alerts opened in the 24 hours up to this morning, ${escapeHtml(day)}:</p>`,
    `<ul>${items.map((i) => `<li><a href="${escapeHtml(nodeLink(appUrl, i.nodeId))}">${escapeHtml(line(i))}</a></li>`).join('')}</ul>`,
  ].join('\n');
  return { subject, text, html };
}
