/** @type {import('next').NextConfig} */
const nextConfig = {
  // better-sqlite3 is a native addon; it must stay a plain Node require on the server.
  // kysely and pg too: one copy per process, shared by every route and the instrumentation hook.
  serverExternalPackages: ['better-sqlite3', 'kysely', 'pg', 'smtp-server', 'mailparser', 'nodemailer', 's3rver', 'sharp', 'piscina'],
  poweredByHeader: false,
  // Every answer: no framing by other sites, no type sniffing, no full URLs leaked to other sites.
  // Pages get their Content-Security-Policy, with a fresh nonce, from proxy.ts; API answers run nothing.
  async headers() {
    return [
      {
        source: '/api/:path*',
        headers: [
          { key: 'Content-Security-Policy', value: "default-src 'none'; img-src 'self' data:; style-src 'unsafe-inline'; frame-ancestors 'none'" },
        ],
      },
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Referrer-Policy', value: 'same-origin' },
        ],
      },
    ];
  },
  // Let the dev server be opened as 127.0.0.1 as well as localhost.
  allowedDevOrigins: ['127.0.0.1'],
  // A separate build folder lets the browser tests build without disturbing `next dev`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
};

export default nextConfig;
