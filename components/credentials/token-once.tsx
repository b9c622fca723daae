'use client';

import { useState } from 'react';

/** The new token, shown this once: a copy button and the caution to store it now. */
export function TokenOnce({ token, label, onDone }: { token: string; label: string; onDone: () => void }) {
  const [copied, setCopied] = useState<'yes' | 'failed' | null>(null);
  async function copy() {
    try {
      await navigator.clipboard.writeText(token);
      setCopied('yes');
    } catch {
      setCopied('failed'); // plain http or a refused permission: the text stays selectable
    }
  }
  return (
    <section aria-labelledby="token-heading" className="rounded-xl border-2 border-ember bg-dusk-900 p-4" data-testid="token-once">
      <h2 id="token-heading" className="font-bold text-ember">Device token{label ? ` for “${label}”` : ''}</h2>
      <p className="mt-1 text-sm font-bold" role="status">Store it now; it cannot be shown again.</p>
      <p className="mt-1 text-sm text-ink-muted">Put it in the device&apos;s configuration as the Bearer token. Anyone holding it can post readings for this node until you revoke it.</p>
      <label htmlFor="token-value" className="sr-only">Device token</label>
      <textarea id="token-value" readOnly value={token} rows={3} onFocus={(e) => e.currentTarget.select()}
        className="figures mt-3 w-full resize-none break-all rounded-md border border-dusk-600 bg-dusk-950 p-2 text-xs text-ink" data-testid="token-value" />
      <div className="mt-2 flex flex-wrap items-center gap-3">
        <button type="button" onClick={copy} className="rounded-md bg-ember px-4 py-2 text-sm font-bold text-dusk-950 hover:opacity-90" data-testid="token-copy">Copy token</button>
        <button type="button" onClick={onDone} className="rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800">I have stored it</button>
        {copied === 'yes' ? <span className="text-sm text-tide" role="status">Copied.</span> : null}
        {copied === 'failed' ? <span className="text-sm text-hazard" role="status">Copying was refused: select the text and copy it by hand.</span> : null}
      </div>
    </section>
  );
}
