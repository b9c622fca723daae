import Link from 'next/link';
import { StateGlyph } from '@/components/state-glyph';
import { alertLine, kindLabel } from '@/lib/alerts/labels';
import type { AlertWire } from './alert-wire';
import { AcknowledgeButton } from './acknowledge-button';
import { AlertFigures } from './alert-figures';
import { MailStatus } from './mail-status';
import { SiteTime } from './site-time';
import { StatusMark } from './status-mark';

const edge: Record<AlertWire['status'], string> = {
  open: 'border-l-hazard',
  acknowledged: 'border-l-ember',
  resolved: 'border-l-dusk-600',
};

/** One alert as a card (the same on a phone and a desk): what, where, when, figures, e-mail. */
export function AlertCard({ alert, canAcknowledge, isOwner, onMessage }: {
  alert: AlertWire;
  canAcknowledge: boolean;
  isOwner: boolean;
  onMessage: (message: string) => void;
}) {
  const headingId = `alert-${alert.id}-title`;
  const tz = alert.time_zone;
  return (
    <article
      aria-labelledby={headingId}
      className={`rounded-xl border border-l-4 border-dusk-700 bg-dusk-900 p-3 sm:p-4 ${edge[alert.status]}`}
      data-testid="alert-card" data-alert-id={alert.id} data-status={alert.status} data-kind={alert.kind}
    >
      <div className="flex items-start justify-between gap-3">
        <div className="min-w-0">
          <StatusMark status={alert.status} />
          <h3 id={headingId} className="mt-1 text-lg font-bold leading-snug">
            {kindLabel(alert.kind)} <span className="sr-only">on {alert.node_name}</span>
          </h3>
          <p className="text-sm text-ink-muted">{alertLine(alert.kind, alert.detail)}</p>
        </div>
        {canAcknowledge && alert.status === 'open' ? <AcknowledgeButton alert={alert} onDone={onMessage} /> : null}
      </div>

      <div className="mt-3 flex flex-wrap items-center gap-x-5 gap-y-2 text-sm">
        <Link href={`/nodes/${alert.node_id}`} className="font-bold text-tide underline decoration-tide/50 underline-offset-4 hover:decoration-tide" data-testid="alert-node">
          {alert.node_name}
        </Link>
        <span className="text-ink-muted">{alert.site_name}</span>
        <span className="inline-flex items-center gap-2 text-xs text-ink-muted">node now <StateGlyph state={alert.node_state} /></span>
      </div>

      <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted" aria-label="Times, in the site's zone">
        <li>Opened <SiteTime at={alert.opened_at} timeZone={tz} /></li>
        <li>Updated <SiteTime at={alert.updated_at} timeZone={tz} /></li>
        {alert.acknowledged_at ? (
          <li>Acknowledged{alert.acknowledged_by_name ? ` by ${alert.acknowledged_by_name}` : ''} <SiteTime at={alert.acknowledged_at} timeZone={tz} /></li>
        ) : null}
        {alert.resolved_at ? <li>Resolved <SiteTime at={alert.resolved_at} timeZone={tz} /></li> : null}
      </ul>

      <AlertFigures alert={alert} />
      <MailStatus alert={alert} showErrors={isOwner} />
    </article>
  );
}
