/**
 * vitest globalSetup of the e2e project: checks that Chromium is there (and fails loudly if
 * not), builds the app if its sources changed, starts it once for all browser tests, and
 * hands the address and database file to the tests through `inject("e2e")`.
 */
import { existsSync } from "node:fs";
import type { TestProject } from "vitest/node";
import { ensureBuild } from "./build";
import { CHROMIUM_PATH } from "./chromium";
import { startApp, type RunningApp } from "./server";

let app: RunningApp | null = null;

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new Error(
      `Browser tests need Chromium at ${CHROMIUM_PATH}, and it is not there. Install it with ` +
        "`apt-get update && apt-get install -y chromium` (or set CHROMIUM_PATH). The tests are not skipped.",
    );
  }
  app = await startApp(ensureBuild(process.env));
  project.provide("e2e", { baseUrl: app.baseUrl, databaseFile: app.databaseFile });
  return async () => {
    await app?.stop();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    e2e: { baseUrl: string; databaseFile: string };
  }
}
