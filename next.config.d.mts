// The type of next.config.mjs, for the tests that read its headers (lib/security-headers.test.ts).
declare const nextConfig: import('next').NextConfig
export default nextConfig
