'use client';

import { useEffect, useState } from 'react';

/**
 * A number that changes whenever the page's theme does (the header's toggle sets
 * `data-theme` on <html>): charts read their colours from CSS variables onto a canvas, so
 * they must draw again with the new ones.
 */
export function useThemeVersion(): number {
  const [version, setVersion] = useState(0);
  useEffect(() => {
    const observer = new MutationObserver(() => setVersion((v) => v + 1));
    observer.observe(document.documentElement, { attributes: true, attributeFilter: ['data-theme'] });
    return () => observer.disconnect();
  }, []);
  return version;
}
