"use client";
/**
 * Upload a new version's specification. Shows what the server said at once: the new version,
 * "identical to vN", or every problem with its JSON pointer and line, so the author can fix
 * the file and drop it again.
 */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useSWRConfig } from "swr";
import { SpecErrors } from "@/components/report/SpecErrors";
import { toApiError, type ApiError } from "./api-client";
import { SPEC_ACCEPT, SPEC_MAX_BYTES, SPEC_NOTE } from "./limits";
import { UploadWidget, type UploadOutcome } from "./UploadWidget";

type Shown =
  | { kind: "created"; fileName: string; number: number }
  | { kind: "identical"; fileName: string; number: number }
  | { kind: "error"; fileName: string; error: ApiError };

interface VersionAnswer {
  status: "created" | "identical";
  version: { number: number };
}

function isVersionAnswer(body: unknown): body is VersionAnswer {
  if (typeof body !== "object" || body === null) return false;
  const b = body as Record<string, unknown>;
  const v = b.version;
  return (b.status === "created" || b.status === "identical") && typeof v === "object" && v !== null && typeof (v as Record<string, unknown>).number === "number";
}

export function SpecUpload({ slug, modelKey }: { slug: string; modelKey: string }) {
  const [shown, setShown] = useState<Shown | null>(null);
  const { mutate } = useSWRConfig();
  const router = useRouter();

  function onResult({ fileName, status, body }: UploadOutcome) {
    if (status >= 200 && status < 300 && isVersionAnswer(body)) {
      setShown({ kind: body.status, fileName, number: body.version.number });
      void mutate(modelKey);
      // Server-rendered parts (headings, the model list) learn of the new version too.
      if (body.status === "created") router.refresh();
      return;
    }
    const error =
      status === 0
        ? toApiError(0, { error: { code: "network", message: "The upload did not reach the server. Check the connection and try again." } })
        : toApiError(status, body);
    setShown({ kind: "error", fileName, error });
  }

  return (
    <div className="space-y-3">
      <UploadWidget
        id="spec-upload"
        endpoint={`/api/v1/models/${encodeURIComponent(slug)}/versions`}
        fieldName="spec"
        restrictions={{ maxFileSize: SPEC_MAX_BYTES, maxNumberOfFiles: 1, allowedFileTypes: SPEC_ACCEPT }}
        note={SPEC_NOTE}
        onResult={onResult}
        height={220}
        dropText="Drop the specification here or %{browseFiles}"
      />
      <div aria-live="polite" data-testid="spec-upload-result">
        {shown?.kind === "created" && (
          <p className="rounded-control border border-confirmed/40 bg-confirmed-wash px-3 py-2 text-sm">
            <strong>v{shown.number}</strong> was made from {shown.fileName}. It was queued for verification; its
            status in the list below updates by itself.
          </p>
        )}
        {shown?.kind === "identical" && (
          <p className="rounded-control border border-line-strong bg-sunken px-3 py-2 text-sm">
            {shown.fileName} is identical to <strong>v{shown.number}</strong>, so no new version was made.
          </p>
        )}
        {shown?.kind === "error" && (
          <div className="space-y-2 rounded-control border border-danger/40 bg-danger-wash px-3 py-2 text-sm">
            <p>
              <strong>{shown.fileName}</strong> was not stored: {shown.error.message}
            </p>
            {shown.error.details.length > 0 && (
              <SpecErrors errors={shown.error.details} title="Fix these and upload the file again" />
            )}
          </div>
        )}
      </div>
    </div>
  );
}
