import type { NodeState } from '@/lib/config/node-states';

/**
 * Node states read by shape and word, never by colour alone: a moon-phase glyph per state.
 * steady a full disc, thin a half disc, short a thin crescent, dark an empty ring,
 * silent a dotted ring, new a small hollow square.
 */
function Shape({ state }: { state: NodeState }) {
  switch (state) {
    case 'steady':
      return <circle cx="8" cy="8" r="6.5" fill="currentColor" />;
    case 'thin':
      return (
        <>
          <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeWidth="1.2" />
          <path d="M8 1.5 A6.5 6.5 0 0 1 8 14.5 Z" fill="currentColor" />
        </>
      );
    case 'short':
      return (
        <>
          <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeWidth="1" strokeOpacity="0.55" />
          <path d="M8 1.5 A6.5 6.5 0 0 1 8 14.5 A4.6 6.5 0 0 0 8 1.5 Z" fill="currentColor" />
        </>
      );
    case 'dark':
      return <circle cx="8" cy="8" r="5.8" fill="none" stroke="currentColor" strokeWidth="1.6" />;
    case 'silent':
      return <circle cx="8" cy="8" r="5.8" fill="none" stroke="currentColor" strokeWidth="1.8" strokeDasharray="1.2 2.4" strokeLinecap="round" />;
    case 'new':
      return <rect x="4.5" y="4.5" width="7" height="7" fill="none" stroke="currentColor" strokeWidth="1.4" />;
  }
}

const tone: Record<NodeState, string> = {
  steady: 'text-ember',
  thin: 'text-ember',
  short: 'text-hazard',
  dark: 'text-ink-muted',
  silent: 'text-ink-muted',
  new: 'text-ink-faint',
};

export function StateGlyph({ state, withWord = true, size = 16 }: { state: NodeState; withWord?: boolean; size?: number }) {
  return (
    <span className={`inline-flex items-center gap-1.5 ${tone[state]}`} data-state={state}>
      <svg width={size} height={size} viewBox="0 0 16 16" aria-hidden="true" focusable="false">
        <Shape state={state} />
      </svg>
      {withWord ? <span className="text-sm font-bold tracking-wide text-ink">{state}</span> : <span className="sr-only">{state}</span>}
    </span>
  );
}
