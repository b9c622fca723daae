'use client';

import { useEffect, useState } from 'react';
import { useThemeVersion } from '../charts/use-theme-version';

/**
 * Chart colours from the theme's CSS variables ("R G B"), read once the page is in the browser
 * (canvas needs real colour strings; the server only renders the chart's frame), and again
 * whenever the theme changes.
 */
export interface ChartPalette {
  ember: string;
  emberSoft: string;
  emberFill: string;
  tide: string;
  hazard: string;
  ink: string;
  inkMuted: string;
  inkFaint: string;
}

const FALLBACK: ChartPalette = {
  ember: 'rgb(244,172,92)', emberSoft: 'rgba(244,172,92,0.35)', emberFill: 'rgba(244,172,92,0.12)', tide: 'rgb(104,208,220)',
  hazard: 'rgb(255,122,110)', ink: 'rgb(230,236,247)', inkMuted: 'rgb(168,181,206)', inkFaint: 'rgb(120,134,164)',
};

function readVar(name: string, alpha = 1): string {
  const raw = getComputedStyle(document.documentElement).getPropertyValue(name).trim();
  const parts = raw.split(/\s+/).filter(Boolean);
  if (parts.length !== 3) return '';
  return alpha === 1 ? `rgb(${parts.join(',')})` : `rgba(${parts.join(',')},${alpha})`;
}

export function useChartPalette(): ChartPalette {
  const [palette, setPalette] = useState<ChartPalette>(FALLBACK);
  const themeVersion = useThemeVersion();
  useEffect(() => {
    const p = {
      ember: readVar('--ember'), emberSoft: readVar('--ember', 0.35), emberFill: readVar('--ember', 0.12), tide: readVar('--tide'),
      hazard: readVar('--hazard'), ink: readVar('--ink'), inkMuted: readVar('--ink-muted'), inkFaint: readVar('--ink-faint'),
    };
    if (Object.values(p).every(Boolean)) setPalette(p);
  }, [themeVersion]);
  return palette;
}
