/**
 * Inside the workspace frame (its header and side navigation are already on the page), so
 * only the message: a model that does not exist and another author's private model look alike.
 */
import { ButtonLink } from "@/components/ui/Button";

export default function ModelNotFound() {
  return (
    <div className="flex max-w-xl flex-col items-start gap-4" data-testid="status-404">
      <p className="font-mono text-sm text-ochre">404</p>
      <h1 className="text-2xl font-bold">No model of yours at this address</h1>
      <p className="text-ink-soft">
        The link may be incomplete, or the model belongs to someone else: private models are shown only to their
        authors, administrators and the editors of their venue.
      </p>
      <ButtonLink href="/workspace/models" kind="secondary">
        Your models
      </ButtonLink>
    </div>
  );
}
