/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; pdfkit reads its font data from disk:
  // bundling either breaks them (see DEVELOPERS.md).
  serverExternalPackages: ['sequelize', 'mariadb', 'pdfkit'],
  poweredByHeader: false,
  reactStrictMode: true,
  // forbidden() renders app/forbidden.tsx with a real 403 status.
  experimental: { authInterrupts: true },
};

export default nextConfig;
