import type { Metadata } from 'next';
import { BenchBoard } from '@/components/bench/bench-board';
import { BenchCautions } from '@/components/bench/bench-cautions';
import { BenchMethod } from '@/components/bench/bench-method';
import { requireMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listBenchBatches } from '@/lib/db/queries/bench';

export const metadata: Metadata = { title: 'Bench' };

export default async function BenchPage() {
  const member = await requireMember('fleet:read');
  const batches = await listBenchBatches(member.orgId);
  const canUpload = can(member.role, 'bench:write');
  return (
    <section>
      <h1 className="text-2xl font-bold">Cells on the bench</h1>
      <p className="mt-1 max-w-3xl text-sm text-ink-muted">
        Measure each cell of a batch before it goes out: capacitance and ESR against the maker&apos;s rating.
        {canUpload ? '' : ' Deployers and owners upload logs; you can read every batch.'}
      </p>
      <div className="mt-4 grid gap-4 items-start lg:grid-cols-[minmax(0,1fr)_22rem]"><BenchMethod /><BenchCautions /></div>
      <BenchBoard initial={batches} canUpload={canUpload} />
    </section>
  );
}
