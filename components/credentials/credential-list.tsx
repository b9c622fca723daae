import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';
import { RevokeButton } from './revoke-button';

export interface CredentialRow {
  id: number;
  label: string;
  createdAt: Date | string;
  lastUsedAt: Date | string | null;
  revokedAt: Date | string | null;
  createdBy: string | null;
}

const at = (d: Date | string | null, zone: string) => (d ? formatInTimeZone(new Date(d), zone, TIME_PATTERNS.record) : null);

/** The node's credentials: metadata only (the database never holds a token). Cards, so it reads at 390 px too. */
export function CredentialList({ nodeId, rows, timeZone, canManage }: { nodeId: number; rows: CredentialRow[]; timeZone: string; canManage: boolean }) {
  if (rows.length === 0) {
    return <p className="rounded-xl border border-dashed border-dusk-600 p-4 text-sm text-ink-muted" data-testid="credentials-empty">No credentials yet: the node cannot post readings until one is created.</p>;
  }
  return (
    <ul className="flex flex-col gap-2" aria-label="Credentials" data-testid="credential-list">
      {rows.map((c) => (
        <li key={c.id} className={`rounded-xl border p-3 ${c.revokedAt ? 'border-dusk-800 bg-dusk-950' : 'border-dusk-700 bg-dusk-900'}`} data-testid="credential-row" data-revoked={c.revokedAt ? 'yes' : 'no'}>
          <div className="flex flex-wrap items-start justify-between gap-2">
            <p className="font-bold">{c.label || <span className="font-normal italic text-ink-muted">no label</span>} <span className="figures text-xs font-normal text-ink-faint">#{c.id}</span></p>
            {c.revokedAt
              ? <span className="rounded border border-dusk-600 px-2 py-0.5 text-xs text-ink-muted">revoked {at(c.revokedAt, timeZone)}</span>
              : <span className="rounded border border-tide px-2 py-0.5 text-xs text-tide">live</span>}
          </div>
          <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
            <dt className="text-ink-faint">Created</dt><dd className="figures">{at(c.createdAt, timeZone)}{c.createdBy ? <span className="font-sans text-ink-muted"> by {c.createdBy}</span> : null}</dd>
            <dt className="text-ink-faint">Last used</dt><dd className="figures">{at(c.lastUsedAt, timeZone) ?? <span className="font-sans text-ink-muted">never</span>}</dd>
          </dl>
          {canManage && !c.revokedAt ? <RevokeButton nodeId={nodeId} credentialId={c.id} label={c.label} /> : null}
        </li>
      ))}
    </ul>
  );
}
