import Link from "next/link";
import { Narrow } from "@/components/layout/Shell";
import { SignInLink } from "@/components/layout/SignInLink";
import { LockIcon } from "@/components/status/icons";

export default function Unauthorized() {
  return (
    <Narrow>
      <div className="flex flex-col items-start gap-4" data-testid="status-401">
        <p className="inline-flex items-center gap-2 text-sm font-semibold text-ochre">
          <LockIcon /> Sign-in needed
        </p>
        <h1 className="text-2xl font-bold">Sign in to open this page</h1>
        <p className="text-ink-soft">
          This page belongs to a signed-in workspace. Sign in and you will come straight back here. No account yet?{" "}
          <Link href="/sign-up" className="rp-link">
            Create one
          </Link>
          .
        </p>
        <SignInLink />
      </div>
    </Narrow>
  );
}
