import { AreaNav, WORKSPACE_NAV } from "@/components/layout/AreaNav";
import { pageUser } from "@/lib/authz";

// The check here gives the right status (401) before anything streams; each page checks again
// because a layout is not re-rendered on every client-side navigation.
export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const me = await pageUser();
  return (
    <div className="flex flex-col gap-8 md:flex-row">
      <AreaNav title="Workspace" entries={WORKSPACE_NAV} role={me.role} />
      <div className="min-w-0 flex-1">{children}</div>
    </div>
  );
}
