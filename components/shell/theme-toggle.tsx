'use client';

import { useEffect, useState } from 'react';

/** Dark first, for dusk in the field; light on request, remembered on this device. */
export function ThemeToggle() {
  const [theme, setTheme] = useState<'dark' | 'light'>('dark');
  useEffect(() => {
    const saved = window.localStorage.getItem('dw-theme') === 'light' ? 'light' : 'dark';
    setTheme(saved);
    document.documentElement.dataset.theme = saved;
  }, []);
  const next = theme === 'dark' ? 'light' : 'dark';
  return (
    <button
      type="button"
      onClick={() => {
        setTheme(next);
        document.documentElement.dataset.theme = next;
        window.localStorage.setItem('dw-theme', next);
      }}
      className="rounded-md border border-dusk-600 px-2.5 py-1.5 text-xs text-ink-muted hover:bg-dusk-800 hover:text-ink"
      aria-label={`Switch to the ${next} theme`}
      data-testid="theme-toggle"
    >
      {theme === 'dark' ? 'Light' : 'Dark'}
    </button>
  );
}
