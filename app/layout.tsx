import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import './globals.css';

// Faces ship in fonts/ (copied from @fontsource packages) so the build never
// touches the network: Atkinson Hyperlegible for reading, Fraunces for headings.
const ui = localFont({
  src: [
    { path: '../fonts/atkinson-hyperlegible-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../fonts/atkinson-hyperlegible-latin-400-italic.woff2', weight: '400', style: 'italic' },
    { path: '../fonts/atkinson-hyperlegible-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
  variable: '--font-ui',
  display: 'swap',
});

const display = localFont({
  src: [
    { path: '../fonts/fraunces-latin-600-normal.woff2', weight: '600', style: 'normal' },
    { path: '../fonts/fraunces-latin-800-normal.woff2', weight: '800', style: 'normal' },
  ],
  variable: '--font-display',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Quadrille', template: '%s · Quadrille' },
  description: 'A shared thumbnail board for wordless four-panel gag comics.',
  icons: { icon: '/icon.svg' },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1 };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request: its scripts carry that request's CSP nonce (proxy.ts).
  await connection();
  return (
    <html lang="en" className={`${ui.variable} ${display.variable}`}>
      <body>{children}</body>
    </html>
  );
}
