/** @type {import('next').NextConfig} */
const nextConfig = {
  // A second build directory lets a developer build and run a copy beside another build (default .next).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Native and ORM packages stay outside the bundle and load from node_modules at run time.
  serverExternalPackages: ['sequelize', 'sqlite3', 'pg', 'smtp-server', 'nodemailer', 'bcryptjs'],
  poweredByHeader: false,
  reactStrictMode: true,
  // forbidden() renders app/forbidden.tsx with a 403 status.
  experimental: { authInterrupts: true },
  // Types are checked once, by `npm run typecheck` (CI runs it before the tests), not again inside every build.
  typescript: { ignoreBuildErrors: true },
};

module.exports = nextConfig;
