import type { ImportReport as StoredImportReport } from '@/lib/ingest/import-csv';
import { importReason, importWord } from '@/lib/ingest/import-outcome';

/** The server's import report; a stored import may also still be running. */
export type ImportSummary = Omit<StoredImportReport, 'status'> & { status: StoredImportReport['status'] | 'running' };

const HEADLINES = { 'nothing imported': 'Nothing imported', failed: 'The import stopped', 'nothing new': 'Nothing new' } as const;

/** Counts first, then the rejected lines with their reasons (the first 200 are kept). */
export function ImportReport({ report, testId = 'import-report' }: { report: ImportSummary; testId?: string }) {
  const word = importWord(report);
  const reason = report.reason ?? importReason(report);
  const counts = [
    ['Lines', report.lines, 'lines'],
    ['Accepted', report.accepted, 'accepted'],
    ['Duplicates', report.duplicates, 'duplicates'],
    ['Rejected', report.rejected, 'rejected'],
  ] as const;
  return (
    <div data-testid={testId}>
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {counts.map(([label, n, key]) => (
          <div key={key} className="rounded-lg border border-dusk-700 bg-dusk-950 px-3 py-2">
            <dt className="text-xs uppercase tracking-wider text-ink-faint">{label}</dt>
            <dd className={`figures text-xl ${key === 'rejected' && n > 0 ? 'text-hazard' : ''}`} data-testid={`import-${key}`}>{n.toLocaleString('en-US')}</dd>
          </div>
        ))}
      </dl>
      {word === 'nothing imported' || word === 'failed' || word === 'nothing new' ? (
        <p className={`mt-2 text-sm ${word === 'nothing new' ? 'text-ink-muted' : 'font-bold text-hazard'}`} data-testid="import-outcome" data-word={word}>
          {HEADLINES[word]}{reason ? `: ${reason}` : '.'}
        </p>
      ) : null}
      {report.rejections.length ? (
        <details className="mt-3" open={report.rejections.length <= 20}>
          <summary className="cursor-pointer text-sm font-bold">Rejected lines{report.rejected > report.rejections.length ? ` (first ${report.rejections.length} of ${report.rejected})` : ''}</summary>
          <ol className="mt-2 max-h-72 overflow-auto rounded-md border border-dusk-700 text-sm" data-testid="import-rejections">
            {report.rejections.map((r, i) => (
              <li key={i} className="flex gap-3 border-t border-dusk-800 px-3 py-1.5 first:border-t-0">
                <span className="figures w-16 shrink-0 text-ink-faint">{r.line ? `line ${r.line}` : 'file'}</span>
                <span className="break-words">{r.reason}</span>
              </li>
            ))}
          </ol>
        </details>
      ) : null}
    </div>
  );
}
