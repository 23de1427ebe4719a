/** @type {import('next').NextConfig} */
const nextConfig = {
  // A parallel test slot builds into its own folder (tests/run.ts sets it); the default is .next.
  distDir: process.env.FLUXYARD_DIST_DIR || ".next",
  poweredByHeader: false,
  serverExternalPackages: ["pg", "pg-boss", "sharp"],
};

export default nextConfig;
