import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { figureFont, textFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Duskwatch', template: '%s · Duskwatch' },
  description: 'Which supercapacitor nodes make it to sunrise, and with what margin.',
  icons: { icon: '/favicon.svg' },
};

export const viewport: Viewport = { themeColor: '#0b1120', width: 'device-width', initialScale: 1 };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" data-theme="dark" className={`${textFont.variable} ${figureFont.variable}`}>
      <body className="min-h-screen font-sans antialiased">{children}</body>
    </html>
  );
}
