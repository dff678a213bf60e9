import { configDefaults, defineConfig } from "vitest/config";
import path from "node:path";

const alias = {
  "@": path.resolve(import.meta.dirname),
  // next's "server-only" guard throws outside a React Server environment; tests run server code directly.
  "server-only": path.resolve(import.meta.dirname, "tests/support/server-only.ts"),
};

/**
 * Three projects, all run by `npm test`:
 * - unit: everything under tests/ except the two below;
 * - integration: tests/integration (real SQLite files in temp folders, the fake SMTP server);
 * - e2e: tests/e2e, Chromium against the built app (tests/e2e/support/global-setup.ts builds
 *   it when sources changed and starts it once).
 */
export default defineConfig({
  resolve: { alias },
  test: {
    environment: "node",
    testTimeout: 30_000,
    hookTimeout: 180_000,
    pool: "forks",
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          sequence: { groupOrder: 0 },
          include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
          exclude: [...configDefaults.exclude, "tests/integration/**", "tests/e2e/**"],
          fileParallelism: true,
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          sequence: { groupOrder: 0 },
          include: ["tests/integration/**/*.test.ts"],
          fileParallelism: true,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          // After unit and integration tests, so timing-sensitive tests do not share the CPU with a browser.
          sequence: { groupOrder: 1 },
          globalSetup: ["tests/e2e/support/global-setup.ts"],
          // One app and one browser per file; files run one after another on this 2-core machine.
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 600_000,
        },
      },
    ],
  },
});
