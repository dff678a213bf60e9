/** The bar on every page: the mark, the places this visitor may go, and who is signed in. */
import Link from "next/link";
import { Wordmark } from "@/components/brand/LogoMark";
import { env } from "@/lib/env";
import { AccountArea, AccountNav } from "./AccountArea";

function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  return (
    <Link href={href} className="shrink-0 whitespace-nowrap rounded-[var(--radius-control)] px-2.5 py-1.5 text-sm font-medium text-ink-soft hover:bg-sunken hover:text-ink">
      {children}
    </Link>
  );
}

/**
 * Static on the server: the session is read in the browser (AccountArea), so the header does not
 * make every page dynamic. Whether captured mail exists is a server fact, passed down.
 */
export function SiteHeader() {
  return (
    <header className="border-b border-line bg-surface/90">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
        <Link href="/" className="rounded-[var(--radius-control)]" aria-label="Restpoint home">
          <Wordmark />
        </Link>
        {/* One line that scrolls sideways when full: the session's links arrive after the first paint
            and must not wrap to a second row and push the page down. The padding keeps focus rings inside. */}
        <nav aria-label="Main" className="order-last -mx-3.5 flex w-full min-w-0 items-center gap-1 overflow-x-auto p-1 sm:order-none sm:-mx-1 sm:w-auto sm:flex-1">
          <NavLink href="/models">Models</NavLink>
          <AccountNav fakeMail={env.useFakeSmtp} />
        </nav>
        <AccountArea />
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
