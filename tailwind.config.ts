import type { Config } from 'tailwindcss';

/**
 * Duskwatch palette: deep blue-slate "dusk" surfaces for the field at night, one warm
 * "ember" accent for stored energy and one cool "tide" accent for charging. Colours come
 * from CSS variables so the light mode only swaps the variables.
 */
const v = (name: string) => `rgb(var(--${name}) / <alpha-value>)`;

const config: Config = {
  darkMode: ['class', '[data-theme="dark"]'],
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        dusk: { 950: v('dusk-950'), 900: v('dusk-900'), 800: v('dusk-800'), 700: v('dusk-700'), 600: v('dusk-600') },
        ink: { DEFAULT: v('ink'), muted: v('ink-muted'), faint: v('ink-faint') },
        ember: { DEFAULT: v('ember'), soft: v('ember-soft') },
        tide: { DEFAULT: v('tide'), soft: v('tide-soft') },
        hazard: v('hazard'),
      },
      fontFamily: {
        sans: ['var(--font-text)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-figures)', 'ui-monospace', 'monospace'],
      },
    },
  },
  plugins: [],
};

export default config;
