/** The bar on every page: the mark, the places this visitor may go, and who is signed in. */
import Link from "next/link";
import { Wordmark } from "@/components/brand/LogoMark";
import { getActor, hasRole } from "@/lib/authz";
import { env } from "@/lib/env";
import { SignOutButton } from "./SignOutButton";

const ROLE_WORD = { author: "Author", editor: "Editor", admin: "Administrator" } as const;

function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  return (
    <Link href={href} className="rounded-[var(--radius-control)] px-2.5 py-1.5 text-sm font-medium text-ink-soft hover:bg-sunken hover:text-ink">
      {children}
    </Link>
  );
}

export async function SiteHeader() {
  const actor = await getActor();
  return (
    <header className="border-b border-line bg-surface/90">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
        <Link href="/" className="rounded-[var(--radius-control)]" aria-label="Restpoint home">
          <Wordmark />
        </Link>
        <nav aria-label="Main" className="order-last -mx-2.5 flex w-full flex-wrap items-center gap-1 sm:order-none sm:mx-0 sm:w-auto sm:flex-1">
          <NavLink href="/models">Models</NavLink>
          {actor === null ? null : <NavLink href="/workspace">Workspace</NavLink>}
          {hasRole(actor, "admin") ? <NavLink href="/admin">Administration</NavLink> : null}
          {actor !== null && env.useFakeSmtp ? <NavLink href="/dev/mail">Captured mail</NavLink> : null}
        </nav>
        <div className="ml-auto flex items-center gap-2">
          {actor === null ? (
            <>
              <Link href="/sign-in" className="rounded-[var(--radius-control)] px-3 py-1.5 text-sm font-semibold text-tide hover:bg-tide-wash">
                Sign in
              </Link>
              <Link href="/sign-up" className="rounded-[var(--radius-control)] bg-tide px-3 py-1.5 text-sm font-semibold text-on-tide hover:bg-tide-strong">
                Create account
              </Link>
            </>
          ) : (
            <>
              <span className="flex flex-col items-end leading-tight">
                <span className="text-sm font-medium text-ink" data-testid="signed-in-as">
                  {actor.name}
                </span>
                <span className="text-2xs uppercase tracking-wider text-ink-faint" data-testid="signed-in-role">
                  {ROLE_WORD[actor.role]}
                </span>
              </span>
              <SignOutButton />
            </>
          )}
        </div>
      </div>
    </header>
  );
}

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-line">
      <div className="mx-auto flex max-w-6xl flex-col gap-1 px-4 py-6 text-xs text-ink-faint sm:px-6">
        <p>Restpoint re-runs the computational claims of evolutionary game models and reports what it could reproduce.</p>
        <p>A confirmed claim means the numbers were reproduced, not that the model was peer reviewed.</p>
      </div>
    </footer>
  );
}
