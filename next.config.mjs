/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  serverExternalPackages: ["pg", "pg-boss", "sharp"],
};

export default nextConfig;
