/**
 * better-auth on our own database: e-mail and password with required e-mail verification,
 * password reset by mail, roles through the admin plugin (author / editor / admin), and
 * rate limits stored in the database so every app process shares them.
 *
 * Pages, actions and route handlers do not call this for role checks: they use lib/authz.ts.
 * The browser talks to it over /api/auth/* (app/api/auth/[...all]/route.ts).
 */
import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { nextCookies } from "better-auth/next-js";
import { admin } from "better-auth/plugins";
import { adminAc, defaultAc } from "better-auth/plugins/admin/access";
import { db } from "@/db/client";
import * as schema from "@/db/schema";
import { MESSAGES, passwordProblem, signUpSchema } from "@/lib/account-rules";
import { env } from "@/lib/env";
import { passwordResetMail, sendMail, verificationMail } from "@/lib/mail";
import { MAILBOX_COOKIE, MAILBOX_MAX_AGE_SECONDS, signMailbox } from "@/lib/mailbox";
import { findUserIdByEmail } from "@/lib/users";

/** Where a confirmation link lands once better-auth has confirmed the address. */
export const VERIFIED_PATH = "/verify-email?confirmed=1";

const DEV_SECRET = "restpoint-development-secret-not-for-production";
// `next build` collects page data with NODE_ENV=production but without the deployment's secrets.
if (env.isProduction && !env.isBuild && env.authSecret === DEV_SECRET) {
  throw new Error("BETTER_AUTH_SECRET must be set (32+ random characters) when NODE_ENV=production.");
}

/** Who may do what inside better-auth's own admin endpoints; only admins get any of it. */
const roles = {
  author: defaultAc.newRole({ user: [], session: [] }),
  editor: defaultAc.newRole({ user: [], session: [] }),
  admin: adminAc,
};

/** Same-origin requests from both spellings of the local host are fine in development. */
function trustedOrigins(): string[] {
  const origin = new URL(env.authUrl).origin;
  const out = [origin];
  if (origin.includes("://localhost")) out.push(origin.replace("://localhost", "://127.0.0.1"));
  if (origin.includes("://127.0.0.1")) out.push(origin.replace("://127.0.0.1", "://localhost"));
  return out;
}

function bodyField(body: unknown, key: string): unknown {
  return typeof body === "object" && body !== null ? (body as Record<string, unknown>)[key] : undefined;
}

/**
 * The admin plugin's own HTTP endpoints are switched off: role changes, bans and the rest go
 * through lib/authz.ts and lib/users.ts (with the audit trail), never around them. The plugin
 * still supplies the role field and refuses sign-in to banned accounts.
 */
export const DISABLED_ADMIN_PATHS = [
  "set-role", "get-user", "create-user", "update-user", "list-users", "list-user-sessions", "unban-user", "ban-user",
  "impersonate-user", "stop-impersonating", "revoke-user-session", "revoke-user-sessions", "remove-user",
  "set-user-password", "has-permission",
].map((p) => `/admin/${p}`);

export const auth = betterAuth({
  appName: "Restpoint",
  disabledPaths: DISABLED_ADMIN_PATHS,
  baseURL: env.authUrl,
  secret: env.authSecret,
  trustedOrigins: trustedOrigins(),
  telemetry: { enabled: false },
  database: drizzleAdapter(db, {
    provider: "sqlite",
    schema: {
      user: schema.user,
      session: schema.session,
      account: schema.account,
      verification: schema.verification,
      rateLimit: schema.rateLimit,
    },
  }),
  emailAndPassword: {
    enabled: true,
    requireEmailVerification: true,
    minPasswordLength: 1, // our own rule (lib/account-rules.ts) runs first with a clearer message
    maxPasswordLength: 1024,
    resetPasswordTokenExpiresIn: 60 * 60,
    revokeSessionsOnPasswordReset: true,
    async sendResetPassword({ user, url }) {
      await sendMail(passwordResetMail(user.email, user.name, url));
    },
  },
  emailVerification: {
    sendOnSignUp: true,
    sendOnSignIn: true,
    autoSignInAfterVerification: false,
    expiresIn: 60 * 60,
    async sendVerificationEmail({ user, url }) {
      // Every confirmation link (after sign-up, a sign-in attempt or a resend) lands on the same page.
      const link = new URL(url);
      link.searchParams.set("callbackURL", VERIFIED_PATH);
      await sendMail(verificationMail(user.email, user.name, link.toString()));
    },
  },
  session: {
    expiresIn: 60 * 60 * 24 * 14,
    updateAge: 60 * 60 * 24,
  },
  rateLimit: {
    enabled: true,
    storage: "database",
    window: 60,
    max: 200,
    customRules: {
      "/sign-in/email": { window: env.AUTH_SIGN_IN_WINDOW, max: env.AUTH_SIGN_IN_MAX },
      "/sign-up/email": { window: env.AUTH_SIGN_UP_WINDOW, max: env.AUTH_SIGN_UP_MAX },
      "/request-password-reset": { window: 60, max: 3 },
      "/send-verification-email": { window: 60, max: 3 },
    },
  },
  advanced: {
    defaultCookieAttributes: { httpOnly: true, sameSite: "lax" },
    // next start and next dev put the peer address in x-forwarded-for; behind a proxy set it there.
    ipAddress: { ipAddressHeaders: ["x-forwarded-for"] },
  },
  hooks: {
    before: createAuthMiddleware(async (ctx) => {
      if (ctx.path === "/sign-up/email") {
        const parsed = signUpSchema.safeParse({
          name: bodyField(ctx.body, "name"),
          email: bodyField(ctx.body, "email"),
          password: bodyField(ctx.body, "password"),
        });
        if (!parsed.success) {
          const first = parsed.error.issues[0];
          const field = String(first?.path[0] ?? "form");
          const code = field === "email" ? "INVALID_EMAIL" : field === "password" ? "WEAK_PASSWORD" : "INVALID_NAME";
          throw new APIError("BAD_REQUEST", { code, message: first?.message ?? MESSAGES.emailMalformed });
        }
        // Say plainly that the address is taken: a registry of published work has public authors anyway.
        if ((await findUserIdByEmail(parsed.data.email)) !== null) {
          throw new APIError("UNPROCESSABLE_ENTITY", { code: "EMAIL_TAKEN", message: MESSAGES.emailTaken });
        }
      }
      if (ctx.path === "/reset-password" || ctx.path === "/change-password") {
        const password = bodyField(ctx.body, "newPassword");
        const problem = typeof password === "string" ? passwordProblem(password) : MESSAGES.passwordShort;
        if (problem !== null) throw new APIError("BAD_REQUEST", { code: "WEAK_PASSWORD", message: problem });
      }
    }),
    after: createAuthMiddleware(async (ctx) => {
      // Lets this browser read its own verification mail on the captured-mail page (lib/mailbox.ts).
      if (ctx.path !== "/sign-up/email" || !env.useFakeSmtp) return;
      const returned = ctx.context.returned;
      if (isAPIError(returned) || typeof returned !== "object" || returned === null) return;
      const created = (returned as { user?: { email?: unknown } }).user;
      if (typeof created?.email !== "string") return;
      ctx.setCookie(MAILBOX_COOKIE, signMailbox(created.email), {
        httpOnly: true,
        sameSite: "lax",
        path: "/",
        maxAge: MAILBOX_MAX_AGE_SECONDS,
      });
    }),
  },
  plugins: [
    admin({ defaultRole: "author", adminRoles: ["admin"], roles }),
    // Lets server actions that call auth.api set cookies through next/headers; must stay last.
    nextCookies(),
  ],
});

export type AuthSession = typeof auth.$Infer.Session;
