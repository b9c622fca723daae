import { formatInTimeZone } from '../../format/time';
import { escapeHtml } from '../outbox';

/** Small formatting pieces shared by the alert, digest and invitation mails. */
export const LOCAL_PATTERN = 'EEE d MMM HH:mm';

/** An instant in the site's own zone, e.g. "Thu 19 Nov 23:41 PST"; a bad zone falls back to UTC. */
export function localTime(iso: string | Date | null | undefined, timeZone: string): string | null {
  if (!iso) return null;
  const at = iso instanceof Date ? iso : new Date(iso);
  if (Number.isNaN(at.getTime())) return null;
  try {
    return formatInTimeZone(at, timeZone, LOCAL_PATTERN);
  } catch {
    return formatInTimeZone(at, 'UTC', LOCAL_PATTERN);
  }
}

export function formatMargin(margin: number | null | undefined): string {
  return typeof margin === 'number' && Number.isFinite(margin) ? `${margin.toFixed(2)}×` : 'n/a';
}

export function formatMilliwatts(watts: number | null | undefined): string | null {
  return typeof watts === 'number' && Number.isFinite(watts) ? `${(watts * 1000).toFixed(2)} mW` : null;
}

/** A plain-text "label: value" block → the same as an HTML table; values escaped. */
export function htmlRows(rows: [string, string][]): string {
  return `<table cellpadding="4" style="border-collapse:collapse">${rows
    .map(([k, v]) => `<tr><th align="left" style="padding-right:12px">${escapeHtml(k)}</th><td>${escapeHtml(v)}</td></tr>`)
    .join('')}</table>`;
}

export function textRows(rows: [string, string][]): string {
  const width = Math.max(...rows.map(([k]) => k.length));
  return rows.map(([k, v]) => `${(k + ':').padEnd(width + 2)}${v}`).join('\n');
}

export function htmlList(items: string[]): string {
  return `<ul>${items.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`;
}

export function nodeLink(appUrl: string, nodeId: number): string {
  return `${appUrl.replace(/\/+$/, '')}/nodes/${nodeId}`;
}
