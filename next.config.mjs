/** @type {import('next').NextConfig} */
const nextConfig = {
  // The test runner builds into its own folder so a running demo is never swapped out underneath.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  // Native modules and the S3 SDK are loaded from node_modules at run time rather than bundled.
  serverExternalPackages: ["sharp", "@node-rs/argon2", "postgres", "pg-boss"],
  poweredByHeader: false,
  experimental: {
    serverActions: { bodySizeLimit: "8mb" },
    // forbidden() answers 403 with app/forbidden.tsx instead of a generic error page.
    authInterrupts: true,
  },
};

export default nextConfig;
