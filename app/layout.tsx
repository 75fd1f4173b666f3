import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import type { ReactNode } from 'react';
import './globals.css';

const inter = localFont({
  src: '../fonts/inter-latin-wght.woff2',
  variable: '--font-inter',
  weight: '100 900',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Ringpass', template: '%s · Ringpass' },
  description: 'Guided beadlock tire mounting: torque passes, evidence and sign-off.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#0a4f8a' };

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request: its scripts carry that response's CSP nonce (proxy.ts),
  // which a page built ahead of time could not.
  await connection();
  return (
    <html lang="en" className={inter.variable}>
      <body>{children}</body>
    </html>
  );
}
