import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The engine's integrator ships TypeScript source only; point the bundler at its compiled file.
  turbopack: { resolveAlias: { odex: "./node_modules/odex/src/odex.js" } },
  serverExternalPackages: ["@libsql/client", "libsql", "smtp-server", "nodemailer"],
  poweredByHeader: false,
};

export default nextConfig;
