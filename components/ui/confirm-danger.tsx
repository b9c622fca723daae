'use client';

/**
 * The inline confirmation of a step that cannot be undone: the question, a red button that
 * does it (focused, so Enter confirms), and "Keep it" beside it.
 */
export function ConfirmDanger({ label, question, confirm, onConfirm, onCancel, busy = false, testId }: {
  label: string;
  question: string;
  confirm: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
  testId: string;
}) {
  return (
    <div role="group" aria-label={label}>
      <p className="text-sm">{question}</p>
      <div className="mt-2 flex gap-2">
        <button type="button" onClick={onConfirm} disabled={busy} autoFocus className="rounded-md bg-hazard px-3 py-1.5 text-sm font-bold text-dusk-950 disabled:opacity-60" data-testid={testId}>{confirm}</button>
        <button type="button" onClick={onCancel} className="rounded-md border border-dusk-600 px-3 py-1.5 text-sm hover:bg-dusk-800">Keep it</button>
      </div>
    </div>
  );
}
