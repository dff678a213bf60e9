/**
 * The side navigation of the workspace and of administration. Entries are data: add a line
 * to WORKSPACE_NAV or ADMIN_NAV when you add a page there; `roles` limits who sees the entry
 * (the page itself must still check with lib/authz.ts).
 */
import Link from "next/link";
import type { Role } from "@/db/schema";

export interface NavEntry {
  href: string;
  label: string;
  roles: readonly Role[];
}

const ALL: readonly Role[] = ["author", "editor", "admin"];

export const WORKSPACE_NAV: NavEntry[] = [
  { href: "/workspace", label: "Overview", roles: ALL },
  { href: "/workspace/models", label: "Your models", roles: ALL },
  { href: "/workspace/venues", label: "Venues and queues", roles: ["editor", "admin"] },
  { href: "/workspace/settings/tokens", label: "API tokens", roles: ALL },
];

export const ADMIN_NAV: NavEntry[] = [
  { href: "/admin", label: "Overview", roles: ["admin"] },
  { href: "/admin/accounts", label: "Accounts", roles: ["admin"] },
  { href: "/admin/venues", label: "Venues", roles: ["admin"] },
  { href: "/admin/mail", label: "Captured mail", roles: ["admin"] },
];

export function AreaNav({ title, entries, role }: { title: string; entries: readonly NavEntry[]; role: Role }) {
  const visible = entries.filter((e) => e.roles.includes(role));
  return (
    <nav aria-label={title} className="flex flex-col gap-1 md:w-48 md:shrink-0">
      <p className="px-2.5 pb-1 text-2xs font-semibold uppercase tracking-[0.14em] text-ink-faint">{title}</p>
      <ul className="flex flex-row flex-wrap gap-1 md:flex-col">
        {visible.map((e) => (
          <li key={e.href}>
            <Link href={e.href} className="block rounded-[var(--radius-control)] px-2.5 py-1.5 text-sm font-medium text-ink-soft hover:bg-sunken hover:text-ink">
              {e.label}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
