/**
 * Demo data, seeded at start in development (and with RESTPOINT_DEMO=1) and by `npm run seed`.
 * Every step is idempotent: running the seed twice changes nothing the second time.
 *
 * To seed more (models, versions, submissions), write a step in its own file under lib/demo/
 * and add it to DEMO_STEPS below; a step receives what earlier steps made (the accounts by
 * role, the venue) through DemoContext.
 */
import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { user, type Role } from "@/db/schema";
import { auth } from "@/lib/auth";
import { addEditor, upsertVenue, type Venue } from "@/lib/venues";
import { DEMO_ACCOUNTS, DEMO_VENUE } from "./accounts";
import { seedDemoModels } from "./models";

export interface DemoContext {
  /** Demo user ids by role. */
  accounts: Record<Role, { id: string; email: string; name: string }>;
  venue: Venue | null;
}

export interface DemoStep {
  name: string;
  run(ctx: DemoContext): Promise<void>;
}

/** Creates each demo account (verified, with its role and a password) unless it exists. */
async function seedAccounts(ctx: DemoContext): Promise<void> {
  const authCtx = await auth.$context;
  for (const a of DEMO_ACCOUNTS) {
    const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, a.email)).limit(1);
    let id = existing?.id;
    if (id === undefined) {
      const created = await authCtx.internalAdapter.createUser({ name: a.name, email: a.email, emailVerified: true, role: a.role }, { method: "email-password" });
      await authCtx.internalAdapter.linkAccount({
        userId: created.id,
        providerId: "credential",
        accountId: created.id,
        password: await authCtx.password.hash(a.password),
      });
      id = created.id;
    } else {
      // Keep the demo roles true even if someone changed them while trying the admin page.
      await db.update(user).set({ role: a.role, emailVerified: true }).where(eq(user.id, id));
    }
    ctx.accounts[a.role] = { id, email: a.email, name: a.name };
  }
}

async function seedVenue(ctx: DemoContext): Promise<void> {
  ctx.venue = await upsertVenue({ ...DEMO_VENUE });
  await addEditor(ctx.venue.id, ctx.accounts.editor.id);
}

/** In order; later steps may rely on what earlier ones put into the context. */
export const DEMO_STEPS: DemoStep[] = [
  { name: "accounts", run: seedAccounts },
  { name: "venue", run: seedVenue },
  { name: "models", run: seedDemoModels },
];

export async function seedDemo(log: (line: string) => void = () => {}): Promise<DemoContext> {
  const empty = { id: "", email: "", name: "" };
  const ctx: DemoContext = { accounts: { author: empty, editor: empty, admin: empty }, venue: null };
  for (const step of DEMO_STEPS) {
    await step.run(ctx);
    log(`demo: ${step.name} ready`);
  }
  return ctx;
}

export { DEMO_ACCOUNTS, DEMO_VENUE, demoAccount } from "./accounts";
