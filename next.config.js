// Headers every response carries, static files included; the Content-Security-Policy with its
// per-request nonce is added by proxy.ts (lib/security/headers.ts).
const securityHeaders = [
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  // Other sites get our origin only, never a path (reset and invitation pages carry a token in theirs).
  // Tile servers commonly ask for a Referer, so not no-referrer.
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  // The same as the CSP's frame-ancestors 'none', for browsers that read only this header.
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), payment=()' },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  // A second build directory lets a developer build and run a copy beside another build (default .next).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Native and ORM packages stay outside the bundle and load from node_modules at run time.
  serverExternalPackages: ['sequelize', 'sqlite3', 'pg', 'smtp-server', 'nodemailer', 'bcryptjs'],
  poweredByHeader: false,
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders }];
  },
  reactStrictMode: true,
  // forbidden() renders app/forbidden.tsx with a 403 status.
  // The proxy (proxy.ts) buffers request bodies up to this size and silently cuts the rest (default 10 MB),
  // after which a route would see truncated JSON. One byte over the largest body any route accepts
  // (64 MiB, /api/v1/plans and /api/v1/simulations): a longer body reaches apiRoute still longer than its
  // limit, so it is answered 413, counted in bytes.
  experimental: { authInterrupts: true, proxyClientMaxBodySize: 64 * 1024 * 1024 + 1 },
  // Types are checked once, by `npm run typecheck` (CI runs it before the tests), not again inside every build.
  typescript: { ignoreBuildErrors: true },
};

module.exports = nextConfig;
