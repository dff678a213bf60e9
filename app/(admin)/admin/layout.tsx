import { ADMIN_NAV, AreaNav } from "@/components/layout/AreaNav";
import { pageRole } from "@/lib/authz";

// Checked here for the status code (401 / 403 before streaming) and again in every page.
export default async function AdminLayout({ children }: { children: React.ReactNode }) {
  const me = await pageRole("admin");
  return (
    <div className="flex flex-col gap-8 md:flex-row">
      <AreaNav title="Administration" entries={ADMIN_NAV} role={me.role} />
      <div className="min-w-0 flex-1">{children}</div>
    </div>
  );
}
