/** @type {import('next').NextConfig} */
const nextConfig = {
  // better-sqlite3 is a native addon; it must stay a plain Node require on the server.
  serverExternalPackages: ['better-sqlite3'],
  poweredByHeader: false,
  // A separate build folder lets the browser tests build without disturbing `next dev`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
};

export default nextConfig;
