import { headerOptionsFromEnv, securityHeaders } from "./lib/http/security-headers.mjs";

/** @type {import('next').NextConfig} */
const nextConfig = {
  // A parallel test slot builds into its own folder (tests/run.ts sets it); the default is .next.
  distDir: process.env.FLUXYARD_DIST_DIR || ".next",
  // Slot builds are developers' parallel browser runs; the main build (and `npm test`) type-checks.
  typescript: { ignoreBuildErrors: Boolean(process.env.FLUXYARD_DIST_DIR) },
  poweredByHeader: false,
  serverExternalPackages: ["pg", "pg-boss", "sharp"],
  // Fixed when the app is built (see lib/http/security-headers.mjs for which variables it reads).
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders(headerOptionsFromEnv(process.env)) }];
  },
};

export default nextConfig;
