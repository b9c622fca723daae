import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';
import { importWord } from '@/lib/ingest/import-outcome';
import { ImportReport, type ImportSummary } from './import-report';

export interface ImportHistoryRow extends ImportSummary {
  filename: string;
  createdAt: Date | string;
  uploadedBy: string | null;
}

/** Earlier imports of this node, newest first, each with its kept report. */
export function ImportHistory({ rows, timeZone }: { rows: ImportHistoryRow[]; timeZone: string }) {
  if (rows.length === 0) return <p className="rounded-xl border border-dashed border-dusk-600 p-4 text-sm text-ink-muted" data-testid="imports-empty">No imports yet.</p>;
  return (
    <ul className="flex flex-col gap-3" aria-label="Earlier imports" data-testid="import-history">
      {rows.map((r) => {
        const word = importWord(r);
        return (
          <li key={r.id} className="rounded-xl border border-dusk-700 bg-dusk-900 p-3" data-testid="import-row">
            <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
              <p className="break-all font-bold">{r.filename}</p>
              <p className="text-xs text-ink-muted">
                <span className="figures">{formatInTimeZone(new Date(r.createdAt), timeZone, TIME_PATTERNS.record)}</span>
                {r.uploadedBy ? ` · ${r.uploadedBy}` : ''} · <span className={word === 'failed' || word === 'nothing imported' ? 'text-hazard' : ''} data-testid="import-row-status">{word}</span>
              </p>
            </div>
            <ImportReport report={r} testId="import-history-report" />
          </li>
        );
      })}
    </ul>
  );
}
