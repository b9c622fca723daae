const isProduction = process.env.NODE_ENV === 'production';

// Security headers for every response (OWASP ASVS V3/V14): no framing, no sniffing,
// a content security policy without unsafe-eval in production.
const csp = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isProduction ? '' : " 'unsafe-eval'"}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "frame-ancestors 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "object-src 'none'",
].join('; ');

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Parallel test stacks build into their own folder (db/lifecycle/profile.ts).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // Types are checked by tests/api/typecheck.test.ts (tsc over the whole tree), not by the build,
  // so parallel work in progress never blocks another stack's build.
  typescript: { ignoreBuildErrors: true },
  reactStrictMode: true,
  serverExternalPackages: ['knex', 'mysql2', 'nodemailer', 'bcryptjs'],
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'Content-Security-Policy', value: csp },
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
        ],
      },
    ];
  },
};

export default nextConfig;
