/** @type {import('next').NextConfig} */
const nextConfig = {
  // Native modules and the S3 SDK are loaded from node_modules at run time rather than bundled.
  serverExternalPackages: ["sharp", "@node-rs/argon2", "postgres"],
  poweredByHeader: false,
  experimental: {
    serverActions: { bodySizeLimit: "8mb" },
  },
};

export default nextConfig;
