import type { Metadata } from "next";
import { TokenManager } from "@/components/deposit/TokenManager";
import { PageHeader } from "@/components/ui/PageHeader";
import { listApiTokens } from "@/lib/api-tokens";
import { pageUser } from "@/lib/authz";
import { env } from "@/lib/env";
import { createTokenAction, revokeTokenAction } from "./actions";

export const metadata: Metadata = { title: "API tokens" };

export default async function TokensPage() {
  const me = await pageUser();
  const tokens = await listApiTokens(me.userId);
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        overline="Settings"
        title="API tokens"
        lede="A token lets a script or your own CI act as you on the API: upload versions, read reports. Give each use its own token, and revoke one as soon as it is no longer needed or may have leaked."
      />
      <TokenManager tokens={tokens} origin={env.authUrl} create={createTokenAction} revoke={revokeTokenAction} />
    </div>
  );
}
