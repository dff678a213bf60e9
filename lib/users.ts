/**
 * Data access for accounts and roles (better-auth's user table). Callers decide who may call
 * what through lib/authz.ts first; these functions enforce only the rules of the data itself.
 */
import "server-only";
import { asc, count, eq, like, or } from "drizzle-orm";
import { db } from "@/db/client";
import { auditEvent, ROLES, session, user, type Role } from "@/db/schema";
import { Conflict, NotFound, ValidationError } from "@/lib/errors";

export interface Account {
  id: string;
  name: string;
  email: string;
  emailVerified: boolean;
  role: Role;
  banned: boolean;
  createdAt: Date;
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

/** Unknown or empty role values (a hand-edited row) count as the least privileged role. */
export function toRole(value: string | null | undefined): Role {
  return isRole(value) ? value : "author";
}

const columns = {
  id: user.id,
  name: user.name,
  email: user.email,
  emailVerified: user.emailVerified,
  role: user.role,
  banned: user.banned,
  createdAt: user.createdAt,
};

function toAccount(row: { id: string; name: string; email: string; emailVerified: boolean; role: string; banned: boolean | null; createdAt: Date }): Account {
  return { ...row, role: toRole(row.role), banned: row.banned ?? false };
}

export async function findUserIdByEmail(email: string): Promise<string | null> {
  const [row] = await db.select({ id: user.id }).from(user).where(eq(user.email, email.trim().toLowerCase())).limit(1);
  return row?.id ?? null;
}

export async function getAccount(id: string): Promise<Account | null> {
  const [row] = await db.select(columns).from(user).where(eq(user.id, id)).limit(1);
  return row === undefined ? null : toAccount(row);
}

export async function getAccountByEmail(email: string): Promise<Account | null> {
  const [row] = await db.select(columns).from(user).where(eq(user.email, email.trim().toLowerCase())).limit(1);
  return row === undefined ? null : toAccount(row);
}

/** Accounts by e-mail address; `query` matches name or address. */
export async function listAccounts(options: { query?: string; limit?: number; offset?: number } = {}): Promise<{ accounts: Account[]; total: number }> {
  const q = options.query?.trim() ?? "";
  const where = q === "" ? undefined : or(like(user.email, `%${q.toLowerCase()}%`), like(user.name, `%${q}%`));
  const rows = await db
    .select(columns)
    .from(user)
    .where(where)
    .orderBy(asc(user.email))
    .limit(options.limit ?? 200)
    .offset(options.offset ?? 0);
  const [total] = await db.select({ n: count() }).from(user).where(where);
  return { accounts: rows.map(toAccount), total: total?.n ?? 0 };
}

/**
 * Gives `targetId` the role `role` and records who did it. An admin cannot change their own
 * role here (it would let the last admin lock everyone out).
 */
export async function setRole(actorId: string, targetId: string, role: string): Promise<Account> {
  if (!isRole(role)) {
    throw new ValidationError("Choose one of the roles author, editor or admin.", [{ path: "role", message: `Unknown role "${role}".` }]);
  }
  if (actorId === targetId) throw new Conflict("You cannot change your own role. Ask another administrator.");
  const before = await getAccount(targetId);
  if (before === null) throw new NotFound("account");
  if (before.role === role) return before;
  await db.batch([
    db.update(user).set({ role }).where(eq(user.id, targetId)),
    db.insert(auditEvent).values({
      actorId,
      action: "account.role_changed",
      detail: JSON.stringify({ userId: targetId, from: before.role, to: role }),
    }),
  ]);
  return { ...before, role };
}

/** Signed-in sessions of an account (shown to admins; sign-out everywhere uses better-auth). */
export async function sessionCount(userId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(session).where(eq(session.userId, userId));
  return row?.n ?? 0;
}

/** How many accounts hold each role. */
export async function countAccountsByRole(): Promise<Record<Role, number>> {
  const rows = await db.select({ role: user.role, n: count() }).from(user).groupBy(user.role);
  const out: Record<Role, number> = { author: 0, editor: 0, admin: 0 };
  for (const r of rows) out[toRole(r.role)] += r.n;
  return out;
}
