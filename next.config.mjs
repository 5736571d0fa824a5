/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect modules dynamically; bundling it breaks them (see DEVELOPERS.md).
  serverExternalPackages: ['sequelize'],
  poweredByHeader: false,
  reactStrictMode: true,
}

export default nextConfig
