import type { Metadata } from "next";
import { CheckIcon, ClockIcon } from "@/components/status/icons";
import { PageHeader } from "@/components/ui/PageHeader";
import { pageRole } from "@/lib/authz";
import { listAccounts } from "@/lib/users";
import { RoleForm } from "./RoleForm";

export const metadata: Metadata = { title: "Accounts" };

const joined = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" });

export default async function AccountsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const me = await pageRole("admin");
  const params = await searchParams;
  const query = typeof params.q === "string" ? params.q : "";
  const { accounts, total } = await listAccounts({ query });
  return (
    <div className="flex flex-col gap-6">
      <PageHeader overline="Administration" title="Accounts" lede="Every new account is an author. Make someone an editor to let them decide on submissions, or an administrator to manage this server." />
      <form className="flex max-w-md gap-2" role="search">
        <label htmlFor="q" className="sr-only">
          Find an account
        </label>
        <input id="q" name="q" defaultValue={query} placeholder="Name or e-mail address" className="rp-input" />
        <button type="submit" className="rounded-[var(--radius-control)] border border-line-strong px-3 text-sm font-semibold hover:border-tide hover:text-tide">
          Find
        </button>
      </form>
      <p className="text-sm text-ink-soft">
        {query === "" ? `${total} accounts` : `${total} ${total === 1 ? "account matches" : "accounts match"} “${query}”`}
      </p>
      <div className="overflow-x-auto rounded-[var(--radius-card)] border border-line">
        <table className="w-full text-left text-sm">
          <thead className="bg-sunken text-xs uppercase tracking-wider text-ink-faint">
            <tr>
              <th scope="col" className="px-4 py-2.5 font-semibold">Account</th>
              <th scope="col" className="hidden px-4 py-2.5 font-semibold sm:table-cell">Address</th>
              <th scope="col" className="px-4 py-2.5 font-semibold">Role</th>
              <th scope="col" className="hidden px-4 py-2.5 font-semibold md:table-cell">Joined</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-line bg-surface">
            {accounts.map((a) => (
              <tr key={a.id} data-testid={`account-${a.email}`}>
                <td className="px-4 py-3">
                  <span className="font-semibold">{a.name}</span>
                  <span className="block break-all text-xs text-ink-soft">{a.email}</span>
                  <span className="mt-1 block text-xs sm:hidden">{a.emailVerified ? "Address confirmed" : "Address not confirmed"}</span>
                </td>
                <td className="hidden px-4 py-3 sm:table-cell">
                  {a.emailVerified ? (
                    <span className="inline-flex items-center gap-1 text-confirmed">
                      <CheckIcon /> Confirmed
                    </span>
                  ) : (
                    <span className="inline-flex items-center gap-1 text-inconclusive">
                      <ClockIcon /> Not confirmed
                    </span>
                  )}
                </td>
                <td className="px-3 py-3 sm:px-4">
                  {a.id === me.userId ? (
                    <span className="text-ink-soft">Administrator (you)</span>
                  ) : (
                    <RoleForm userId={a.id} email={a.email} role={a.role} />
                  )}
                </td>
                <td className="hidden px-4 py-3 text-ink-soft md:table-cell">{joined.format(a.createdAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
