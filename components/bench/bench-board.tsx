'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import type { BenchBatchWire, BenchRunWire } from '@/lib/schemas/bench-runs';
import { BenchBatches } from './bench-batches';
import { BenchReport } from './bench-report';
import { BenchUploadForm } from './bench-upload-form';

/** The bench: upload (deployers and owners), the last report, and every batch's table. */
export function BenchBoard({ initial, canUpload }: { initial: BenchBatchWire[]; canUpload: boolean }) {
  const client = useQueryClient();
  const [last, setLast] = useState<BenchRunWire | null>(null);
  const query = useQuery({
    queryKey: ['bench', 'runs'],
    queryFn: async () => {
      const res = await apiFetch<{ batches: BenchBatchWire[] }>('/api/v1/bench/runs');
      if (!res.ok) throw new Error(res.problem.detail ?? res.problem.title);
      return res.data.batches;
    },
    initialData: initial,
  });

  return (
    <div className={`mt-6 grid grid-cols-1 gap-6 ${canUpload ? 'lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]' : ''}`}>
      {canUpload ? (
        <div className="flex flex-col gap-4">
          <BenchUploadForm onStored={(run) => { setLast(run); void client.invalidateQueries({ queryKey: ['bench', 'runs'] }); }} />
          {last ? <BenchReport run={last} /> : null}
        </div>
      ) : null}
      <div>
        <h2 className="mb-3 font-bold">Batches</h2>
        {query.isError ? <p className="mb-3 text-sm text-hazard" role="alert">Could not refresh the batches: {query.error.message}</p> : null}
        <BenchBatches batches={query.data} />
      </div>
    </div>
  );
}
