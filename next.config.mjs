/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect modules dynamically; bundling it breaks them (see DEVELOPERS.md).
  // pg-boss runs its own pool and migrations in the mail worker (lib/mail/); kept as Node loads it.
  serverExternalPackages: ['sequelize', 'pg-boss'],
  poweredByHeader: false,
  // No gzip in the Node.js process: compressing each answer there costs the web app CPU on every
  // request (most answers are small JSON), and a deployment's load balancer or proxy compresses
  // (README, "Running on more than one machine"). On loopback (the demo, the tests) it gains nothing.
  compress: false,
  reactStrictMode: true,
  // Fixed security headers, on every answer static files included. A page's Content-Security-Policy
  // (a nonce per page) and HSTS (on https only) come from proxy.ts; see lib/security-headers.ts.
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
        // API answers carry personal data (patterns, the signed-in person): no cache keeps them. They
        // load and run nothing: the closed policy, API_CONTENT_SECURITY_POLICY of
        // lib/security-headers.ts (the page-access test holds the two to the same text). Fixed,
        // so the proxy need not run for API requests.
        source: '/api/:path*',
        headers: [
          { key: 'Cache-Control', value: 'no-store' },
          { key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" },
        ],
      },
    ]
  },
}

export default nextConfig
