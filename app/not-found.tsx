import { Narrow } from "@/components/layout/Shell";
import { ButtonLink } from "@/components/ui/Button";

export default function NotFound() {
  return (
    <Narrow>
      <div className="flex flex-col items-start gap-4" data-testid="status-404">
        <p className="font-mono text-sm text-ochre">404</p>
        <h1 className="text-2xl font-bold">There is nothing at this address</h1>
        <p className="text-ink-soft">The page may have moved, or the link may be incomplete. Some models are private to their authors, and then they are not shown either.</p>
        <ButtonLink href="/" kind="secondary">
          Go to the home page
        </ButtonLink>
      </div>
    </Narrow>
  );
}
