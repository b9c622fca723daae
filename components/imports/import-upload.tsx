'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import type { Problem } from '@/lib/client/api';
import { IMPORT_OVER_RATING_FRACTION } from '@/lib/ingest/import-bank-check';
import { ImportReport, type ImportSummary } from './import-report';

/** Uploads one CSV log (multipart `file`) and shows its report; a failed import still has one. */
export function ImportUpload({ nodeId }: { nodeId: number }) {
  const router = useRouter();
  const [report, setReport] = useState<ImportSummary | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const file = data.get('file');
    if (!(file instanceof File) || file.size === 0) return setError('Choose a CSV file first.');
    setBusy(true);
    setError(null);
    setReport(null);
    try {
      const res = await fetch(`/api/v1/nodes/${nodeId}/imports`, { method: 'POST', body: data, credentials: 'same-origin' });
      const body = await res.json().catch(() => null);
      if (res.ok) setReport(body as ImportSummary);
      else {
        const problem = (body ?? { title: res.statusText }) as Problem & { import?: ImportSummary };
        // A failed import's report carries its reason in its headline: not said twice.
        if (problem.import) setReport(problem.import);
        else setError(problem.errors?.map((e) => e.detail).join(' ') || problem.detail || problem.title);
      }
      router.refresh();
    } catch {
      setError('The server could not be reached. Check the connection and try again.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="import-form">
      <h2 className="font-bold">Upload a CSV log</h2>
      <p className="text-sm text-ink-muted">A header line naming the columns: <code className="figures">t,v</code> and optionally <code className="figures">seq,vp,temp,rssi</code>. Commas between columns and a decimal point in numbers (<code className="figures">4.80</code>). Times as RFC 3339 or Unix seconds. Lines with bank volts below 0 V or more than {Math.round(IMPORT_OVER_RATING_FRACTION * 100)} % above the bank&apos;s rating are refused. Lines already stored count as duplicates, so a file can be sent again safely.</p>
      <div className="flex flex-col gap-1.5">
        <label htmlFor="import-file" className="text-sm font-bold">CSV file</label>
        <input id="import-file" name="file" type="file" accept=".csv,text/csv,text/plain" className="text-sm file:mr-3 file:rounded-md file:border file:border-dusk-600 file:bg-dusk-800 file:px-3 file:py-1.5 file:text-ink" />
      </div>
      <div><Button type="submit" disabled={busy} data-testid="import-submit">{busy ? 'Importing…' : 'Import'}</Button></div>
      {busy ? <p role="status" className="text-sm text-ink-muted">Reading the file line by line; large files take a while.</p> : null}
      {error ? <p role="alert" className="text-sm text-hazard" data-testid="import-error">{error}</p> : null}
      {report ? <ImportReport report={report} /> : null}
    </form>
  );
}
