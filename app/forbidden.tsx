import { Narrow } from "@/components/layout/Shell";
import { LockIcon } from "@/components/status/icons";
import { ButtonLink } from "@/components/ui/Button";

export default function Forbidden() {
  return (
    <Narrow>
      <div className="flex flex-col items-start gap-4" data-testid="status-403">
        <p className="inline-flex items-center gap-2 text-sm font-semibold text-ochre">
          <LockIcon /> Not for your role
        </p>
        <h1 className="text-2xl font-bold">Your account cannot open this page</h1>
        <p className="text-ink-soft">It needs a role your account does not have. If you should have access, ask an administrator of this registry to change your role.</p>
        <ButtonLink href="/workspace" kind="secondary">
          Back to your workspace
        </ButtonLink>
      </div>
    </Narrow>
  );
}
