"use client";
/** Puts a version before the model's venue (a server action), then shows the outcome. */
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";

export type SubmitResult = { ok: boolean; message: string };

export function SubmitVersionButton({ label, submit }: { label: string; submit: () => Promise<SubmitResult> }) {
  const router = useRouter();
  const [result, setResult] = useState<SubmitResult | null>(null);
  const [pending, startTransition] = useTransition();
  return (
    <div className="flex flex-col items-start gap-3">
      <Button
        type="button"
        disabled={pending}
        onClick={() =>
          startTransition(async () => {
            const r = await submit();
            setResult(r);
            if (r.ok) router.refresh();
          })
        }
      >
        {pending ? "Submitting…" : label}
      </Button>
      {result !== null && <Notice tone={result.ok ? "success" : "error"} title={result.message} />}
    </div>
  );
}
