/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; bundling it breaks (see DEVELOPERS.md).
  serverExternalPackages: ['sequelize', 'mariadb'],
  poweredByHeader: false,
  reactStrictMode: true,
  // forbidden() renders app/forbidden.tsx with a real 403 status.
  experimental: { authInterrupts: true },
};

export default nextConfig;
