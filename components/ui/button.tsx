import type { ButtonHTMLAttributes } from 'react';

const styles = {
  primary: 'bg-ember text-dusk-950 hover:opacity-90',
  quiet: 'border border-dusk-600 text-ink hover:bg-dusk-800',
  danger: 'border border-hazard text-hazard hover:bg-dusk-800',
} as const;

export function Button({ tone = 'primary', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: keyof typeof styles }) {
  return <button className={`rounded-md px-4 py-2 text-sm font-bold disabled:cursor-wait disabled:opacity-60 ${styles[tone]} ${className}`} {...props} />;
}
