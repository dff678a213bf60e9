import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // Lets several builds coexist in one checkout (e.g. a developer's dev server beside the e2e build).
  // Config files are read by Next before the app's own modules load, so this one reads the variable directly.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  // The engine's integrator ships TypeScript source only; point the bundler at its compiled file.
  turbopack: { resolveAlias: { odex: "./node_modules/odex/src/odex.js" } },
  serverExternalPackages: ["@libsql/client", "libsql", "smtp-server", "nodemailer"],
  poweredByHeader: false,
  // Next gzips each response anew for clients that ask (a cached page is stored uncompressed):
  // about half the cached model page's rate at 20 connections (npm run bench:web). Behind a
  // proxy that compresses, RESTPOINT_COMPRESS=0 leaves it to the proxy. Read here for the same
  // reason as NEXT_DIST_DIR above.
  compress: process.env.RESTPOINT_COMPRESS !== "0",
  generateEtags: false,
  // forbidden() / unauthorized() give pages real 403 / 401 answers (lib/authz.ts page helpers).
  experimental: { authInterrupts: true },
  // Type checking is its own step (`npm run typecheck`); the build must not wait on it twice.
  // Browser-test builds use their own tsconfig (tests/e2e/support/build.ts) because Next writes its
  // dist folder's type paths into the tsconfig it builds with.
  typescript: { ignoreBuildErrors: true, tsconfigPath: process.env.NEXT_TSCONFIG_PATH ?? "tsconfig.json" },
};

export default nextConfig;
