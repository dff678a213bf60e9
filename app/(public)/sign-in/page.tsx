import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { FormCard } from "@/components/layout/Shell";
import { getActor } from "@/lib/authz";
import { DEMO_ACCOUNTS } from "@/lib/demo/accounts";
import { env } from "@/lib/env";
import { safeNext } from "@/lib/safe-redirect";
import { SignInForm } from "./SignInForm";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const next = safeNext(params.next);
  if ((await getActor()) !== null) redirect(next);
  return (
    <FormCard
      title="Sign in"
      lede={
        <>
          New here?{" "}
          <Link href="/sign-up" className="rp-link">
            Create an account
          </Link>
          . Readers can browse without one.
        </>
      }
    >
      <SignInForm next={next} demoAccounts={env.demoMode ? DEMO_ACCOUNTS.map((a) => ({ ...a })) : []} />
    </FormCard>
  );
}
