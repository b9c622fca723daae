import type { VisitWire } from '@/lib/schemas/visit';

/** Visits newest first; a photo comes through the authorized route, never a public folder. */
export function VisitList({ nodeId, visits }: { nodeId: number; visits: VisitWire[] }) {
  if (visits.length === 0) return <p className="rounded-xl border border-dashed border-dusk-600 p-4 text-sm text-ink-muted" data-testid="visits-empty">No visits recorded yet.</p>;
  return (
    <ol className="flex flex-col gap-3" aria-label="Field visits" data-testid="visit-list">
      {visits.map((v) => {
        const photo = `/api/v1/nodes/${nodeId}/visits/${v.id}/photo`;
        return (
          <li key={v.id} className="flex gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-3" data-testid="visit-row">
            {v.has_photo ? (
              <a href={photo} target="_blank" rel="noopener" className="shrink-0" aria-label={`Photo from the visit on ${v.visited_on}, full size`}>
                {/* eslint-disable-next-line @next/next/no-img-element -- an authorized route, not a static asset */}
                <img src={photo} alt={`Visit on ${v.visited_on}`} width={96} height={96} loading="lazy" className="h-24 w-24 rounded-md border border-dusk-600 object-cover" data-testid="visit-photo" />
              </a>
            ) : null}
            <div className="min-w-0">
              <p className="text-sm"><span className="figures font-bold">{v.visited_on}</span>{v.by ? <span className="text-ink-muted"> · {v.by}</span> : null}</p>
              <p className="mt-1 whitespace-pre-line break-words">{v.work_done}</p>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
