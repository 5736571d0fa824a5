/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect modules dynamically; bundling it breaks them (see DEVELOPERS.md).
  // pg-boss runs its own pool and migrations in the mail worker (lib/mail/); kept as Node loads it.
  serverExternalPackages: ['sequelize', 'pg-boss'],
  poweredByHeader: false,
  reactStrictMode: true,
  // Fixed security headers, on every answer static files included. The Content-Security-Policy (a
  // nonce per page) and HSTS (on https only) come from proxy.ts; see lib/security-headers.ts.
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          // For browsers that predate the policy's frame-ancestors 'none'.
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
        ],
      },
      {
        // API answers carry personal data (patterns, the signed-in person): no cache keeps them.
        source: '/api/:path*',
        headers: [{ key: 'Cache-Control', value: 'no-store' }],
      },
    ]
  },
}

export default nextConfig
