import type { AlertStatus } from '@/lib/alerts/kinds';
import { STATUS_LABELS } from '@/lib/alerts/labels';

/**
 * An alert's life by shape and word: a diamond that empties as the alert is dealt with —
 * open a full diamond, acknowledged a half one, resolved a hollow outline. Diamonds, so they
 * never read as the round node-state glyphs.
 */
function Shape({ status }: { status: AlertStatus }) {
  const outline = <path d="M8 1.8 L14.2 8 L8 14.2 L1.8 8 Z" fill="none" stroke="currentColor" strokeWidth="1.3" strokeLinejoin="round" />;
  if (status === 'open') return <path d="M8 1.2 L14.8 8 L8 14.8 L1.2 8 Z" fill="currentColor" />;
  if (status === 'acknowledged') return <>{outline}<path d="M8 1.8 L8 14.2 L1.8 8 Z" fill="currentColor" /></>;
  return outline;
}

const tone: Record<AlertStatus, string> = { open: 'text-hazard', acknowledged: 'text-ember', resolved: 'text-ink-faint' };

export function StatusMark({ status, size = 14 }: { status: AlertStatus; size?: number }) {
  return (
    <span className={`inline-flex items-center gap-1.5 ${tone[status]}`} data-alert-status={status}>
      <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden="true" focusable="false"><Shape status={status} /></svg>
      <span className="text-xs font-bold uppercase tracking-[0.14em] text-ink">{STATUS_LABELS[status].label}</span>
    </span>
  );
}
