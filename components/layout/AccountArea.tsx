/**
 * The session-dependent parts of the header, filled in the browser from better-auth's session
 * endpoint, so the header never makes a page dynamic and public pages can be cached whole.
 * Until the session is known both parts keep their final size (no layout shift).
 */
"use client";
import Link from "next/link";
import { authClient } from "@/lib/auth-client";
import { SignOutButton } from "./SignOutButton";

type RoleWord = "Author" | "Editor" | "Administrator";

/** The stored role as a word; anything unknown counts as the least privileged role (as lib/users.ts toRole). */
function roleWordOf(user: object): RoleWord {
  const role = "role" in user ? user.role : undefined;
  if (role === "admin") return "Administrator";
  if (role === "editor") return "Editor";
  return "Author";
}

function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  return (
    <Link href={href} className="shrink-0 whitespace-nowrap rounded-[var(--radius-control)] px-2.5 py-1.5 text-sm font-medium text-ink-soft hover:bg-sunken hover:text-ink">
      {children}
    </Link>
  );
}

/** Workspace, Administration and Captured mail, for those who may open them (the pages check again). */
export function AccountNav({ fakeMail }: { fakeMail: boolean }) {
  const { data } = authClient.useSession();
  const user = data?.user ?? null;
  if (user === null) return null;
  return (
    <>
      <NavLink href="/workspace">Workspace</NavLink>
      {roleWordOf(user) === "Administrator" ? <NavLink href="/admin">Administration</NavLink> : null}
      {fakeMail ? <NavLink href="/dev/mail">Captured mail</NavLink> : null}
    </>
  );
}

/** Who is signed in and a sign-out button, or the sign-in and sign-up links. */
export function AccountArea() {
  const { data, isPending } = authClient.useSession();
  const user = data?.user ?? null;
  // min-h-10 holds the tallest state (the two-line name block), so nothing below moves.
  const box = "ml-auto flex min-h-10 items-center gap-2";
  if (isPending && user === null) {
    return (
      <div className={box} aria-busy="true" data-testid="account-pending">
        <span className="block h-8 w-44 rounded-[var(--radius-control)] bg-sunken/60" aria-hidden="true" />
      </div>
    );
  }
  if (user === null) {
    return (
      <div className={box}>
        <Link href="/sign-in" className="rounded-[var(--radius-control)] px-3 py-1.5 text-sm font-semibold text-tide hover:bg-tide-wash">
          Sign in
        </Link>
        <Link href="/sign-up" className="rounded-[var(--radius-control)] bg-tide px-3 py-1.5 text-sm font-semibold text-on-tide hover:bg-tide-strong">
          Create account
        </Link>
      </div>
    );
  }
  return (
    <div className={box}>
      <span className="flex flex-col items-end leading-tight">
        <span className="text-sm font-medium text-ink" data-testid="signed-in-as">
          {user.name}
        </span>
        <span className="text-2xs uppercase tracking-wider text-ink-faint" data-testid="signed-in-role">
          {roleWordOf(user)}
        </span>
      </span>
      <SignOutButton />
    </div>
  );
}
