import type { Metadata } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import './globals.css';

const sans = localFont({
  src: '../public/fonts/inter-latin-wght-normal.woff2',
  variable: '--font-sans',
  weight: '100 900',
  display: 'swap',
});

const mono = localFont({
  src: [
    { path: '../public/fonts/ibm-plex-mono-latin-400-normal.woff2', weight: '400' },
    { path: '../public/fonts/ibm-plex-mono-latin-600-normal.woff2', weight: '600' },
  ],
  variable: '--font-mono',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Evenload', template: '%s · Evenload' },
  description: 'The web lab for bolted flange joint assembly: per-stud load runs, scatter and elastic interaction.',
};

/**
 * Every page renders per request: proxy.ts gives each request a CSP nonce, which Next puts on its
 * scripts only when the HTML is rendered for that request (a prerendered page would carry none).
 */
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen bg-paper font-sans text-ink antialiased">{children}</body>
    </html>
  );
}
