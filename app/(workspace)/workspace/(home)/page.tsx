import type { Metadata } from "next";
import Link from "next/link";
import { ModelList } from "@/components/deposit/ModelList";
import { ButtonLink } from "@/components/ui/Button";
import { EmptyState } from "@/components/ui/EmptyState";
import { PageHeader, Section } from "@/components/ui/PageHeader";
import type { Role } from "@/db/schema";
import { pageUser } from "@/lib/authz";
import { listModelsForOwner } from "@/lib/models";
import { countAccountsByRole } from "@/lib/users";
import { listVenuesForEditor } from "@/lib/venues";

export const metadata: Metadata = { title: "Workspace" };

const ROLE_LEDE = {
  author: "Deposit your models and follow what the re-runs found.",
  editor: "Work through the submissions to your venues and record decisions.",
  admin: "Look after accounts and roles, and the mail this server sends.",
} as const;

async function VenuesSection({ userId }: { userId: string }) {
  const venues = await listVenuesForEditor(userId);
  return (
    <Section title="Your venues" id="venues" description="The journals and collections you decide submissions for.">
      {venues.length === 0 ? (
        <EmptyState title="You are not an editor of any venue yet.">An administrator assigns editors to venues. Once you are assigned, the venue and its queue appear here.</EmptyState>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2">
          {venues.map((v) => (
            <li key={v.id} className="rp-card flex flex-col gap-2 p-5">
              <h3 className="font-semibold">{v.name}</h3>
              <p className="text-sm text-ink-soft">{v.description}</p>
              <Link href={`/workspace/venues/${v.slug}`} className="rp-link mt-1 self-start text-sm font-semibold">
                Open the queue
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}

async function AdminSection() {
  const counts = await countAccountsByRole();
  return (
    <Section title="Administration" id="administration" description="Accounts by role on this server.">
      <dl className="grid grid-cols-3 gap-4">
        {(["author", "editor", "admin"] as const).map((r) => (
          <div key={r} className="rp-card p-4">
            <dt className="text-xs font-semibold uppercase tracking-wider text-ink-faint">{r === "admin" ? "Administrators" : `${r[0]?.toUpperCase()}${r.slice(1)}s`}</dt>
            <dd className="font-mono text-2xl">{counts[r]}</dd>
          </div>
        ))}
      </dl>
      <div className="flex flex-wrap gap-3">
        <ButtonLink href="/admin/accounts">Manage accounts and roles</ButtonLink>
        <ButtonLink href="/admin/mail" kind="secondary">
          Captured mail
        </ButtonLink>
      </div>
    </Section>
  );
}

const RECENT_MODELS = 5;

async function ModelsSection({ userId, role }: { userId: string; role: Role }) {
  const models = await listModelsForOwner({ id: userId, role });
  return (
    <Section title="Your models" id="models" description="Models you deposited, with the verdict of each version's re-run.">
      {models.length === 0 ? (
        <EmptyState title="You have not deposited a model yet." action={<ButtonLink href="/workspace/models/new">Deposit a model</ButtonLink>}>
          A deposit is a model specification: strategies, payoffs, parameters, dynamics and the claims your paper makes. Restpoint re-runs it and reports on every claim.
        </EmptyState>
      ) : (
        <>
          <ModelList models={models.slice(0, RECENT_MODELS)} />
          <div className="flex flex-wrap gap-3">
            <ButtonLink href="/workspace/models" kind="secondary">
              {models.length > RECENT_MODELS ? `All ${models.length} models` : "Manage your models"}
            </ButtonLink>
            <ButtonLink href="/workspace/models/new">Deposit a model</ButtonLink>
          </div>
        </>
      )}
    </Section>
  );
}

export default async function WorkspacePage() {
  const me = await pageUser();
  return (
    <div className="flex flex-col gap-10" data-testid={`workspace-${me.role}`}>
      <PageHeader overline={me.role === "admin" ? "Administrator" : me.role === "editor" ? "Editor" : "Author"} title={`Welcome, ${me.name}`} lede={ROLE_LEDE[me.role]} />
      {me.role === "admin" ? <AdminSection /> : null}
      {me.role === "editor" ? <VenuesSection userId={me.userId} /> : null}
      <ModelsSection userId={me.userId} role={me.role} />
    </div>
  );
}
