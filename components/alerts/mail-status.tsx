import type { ReactNode } from 'react';
import type { AlertWire } from './alert-wire';
import { SiteTime } from './site-time';

/**
 * What became of the alert's e-mails, in words: sent, pending (waiting or retrying), held by
 * the hourly cap (with when it goes), dead (given up). Owners also see the relay's error.
 */
export function MailStatus({ alert, showErrors }: { alert: AlertWire; showErrors: boolean }) {
  const m = alert.mail;
  const waiting = m.pending - m.held;
  const total = m.pending + m.sent + m.dead;
  const parts: ReactNode[] = [];
  if (m.sent) parts.push(<span key="sent">{m.sent} sent</span>);
  if (waiting > 0) parts.push(<span key="pending">{waiting} pending</span>);
  if (m.held) parts.push(<span key="held">{m.held} held until <SiteTime at={m.held_until} timeZone={alert.time_zone} /></span>);
  if (m.dead) parts.push(<span key="dead" className="font-bold text-hazard">{m.dead} dead</span>);
  return (
    <div className="mt-3 border-t border-dusk-800 pt-2 text-xs text-ink-muted" data-testid="alert-mail">
      <span className="font-bold text-ink">E-mail: </span>
      {total === 0 ? <span>none — nobody was subscribed to this kind here</span> : parts.map((p, i) => <span key={i}>{i ? ' · ' : ''}{p}</span>)}
      {showErrors && m.last_error && !m.last_error.startsWith('held') ? (
        <p className="mt-1 break-words"><span className="text-ink">Last error:</span> <span className="figures">{m.last_error}</span></p>
      ) : null}
    </div>
  );
}
