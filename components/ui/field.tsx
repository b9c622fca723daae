import type { InputHTMLAttributes } from 'react';

/** A labelled input with its error beside it, in the server's words. */
export function Field({ label, error, hint, id, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string; id: string }) {
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-bold text-ink">{label}</label>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className="rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-ink placeholder:text-ink-faint focus:border-tide focus:outline-none"
        {...input}
      />
      {hint && !error ? <p id={`${id}-hint`} className="text-xs text-ink-faint">{hint}</p> : null}
      {error ? <p id={`${id}-error`} className="text-sm text-hazard" role="alert">{error}</p> : null}
    </div>
  );
}
