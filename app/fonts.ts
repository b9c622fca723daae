import localFont from 'next/font/local';

// Shipped with the app (SIL Open Font License, see app/fonts/OFL-*.txt); nothing is fetched.
export const textFont = localFont({
  src: [
    { path: './fonts/atkinson-hyperlegible-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: './fonts/atkinson-hyperlegible-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-text',
  display: 'swap',
});

export const figureFont = localFont({
  src: [
    { path: './fonts/atkinson-hyperlegible-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: './fonts/atkinson-hyperlegible-mono-latin-600-normal.woff2', weight: '600', style: 'normal' },
  ],
  variable: '--font-figures',
  display: 'swap',
});
