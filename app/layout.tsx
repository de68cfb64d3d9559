import type { Metadata, Viewport } from 'next';
import { connection } from 'next/server';
import localFont from 'next/font/local';
import './globals.css';

// Inter, shipped by its npm package (no download at build or run time).
const inter = localFont({
  src: '../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2',
  variable: '--font-inter',
  display: 'swap',
  weight: '100 900',
});

export const metadata: Metadata = {
  title: { default: 'Thawline', template: '%s · Thawline' },
  description: 'Overnight oil-temperature forecasts and least-cost preheat plans for light piston aircraft.',
};

export const viewport: Viewport = {
  width: 'device-width',
  initialScale: 1,
  themeColor: [
    { media: '(prefers-color-scheme: light)', color: '#f1f8fb' },
    { media: '(prefers-color-scheme: dark)', color: '#020617' },
  ],
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request: its scripts carry the nonce of that response's
  // Content-Security-Policy (proxy.ts), which a page built ahead of time could not.
  await connection();
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-dvh font-sans">{children}</body>
    </html>
  );
}
