/**
 * Runs once when a server process starts (next dev / next start). Node.js runtime only:
 * applies migrations, starts the fake SMTP server when no real one is configured, seeds the
 * demo data when asked, then starts background work.
 */
export async function register(): Promise<void> {
  // NEXT_RUNTIME is a build-time constant that Next inlines per bundle, not configuration.
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env } = await import("@/lib/env");
  if (env.isBuild) return;

  const { migrateDatabase } = await import("@/db/migrate");
  await migrateDatabase();

  if (env.useFakeSmtp) {
    const { startFakeSmtp } = await import("@/lib/fake-smtp");
    const { port } = await startFakeSmtp();
    console.log(`[restpoint] fake SMTP on 127.0.0.1:${port}; captured mail at /dev/mail and /admin/mail`);
  } else if (env.SMTP_URL === undefined) {
    console.warn("[restpoint] SMTP_URL is not set: verification and reset mail cannot be sent");
  }

  if (env.seedDemo) {
    const { seedDemo } = await import("@/lib/demo");
    await seedDemo();
    console.log("[restpoint] demo accounts and venue ready (see README)");
  }

  // ---- Background work: the inline verification worker starts here. ----
  // (lib/worker exposes startInlineWorker(); it honours env.RESTPOINT_INLINE_WORKER.)
  (await import("@/lib/worker")).startInlineWorker();
  // ---- end of background work ----
}
