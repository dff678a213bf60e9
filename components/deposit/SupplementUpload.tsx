"use client";
/** Attach supplementary files (data, a manuscript PDF, code archives) to one version. */
import { useState } from "react";
import { useSWRConfig } from "swr";
import { toApiError } from "./api-client";
import { filesKey } from "./keys";
import { SUPPLEMENT_ACCEPT, SUPPLEMENT_MAX_BYTES, SUPPLEMENT_NOTE } from "./limits";
import { UploadWidget, type UploadOutcome } from "./UploadWidget";

interface Line {
  fileName: string;
  ok: boolean;
  text: string;
}

export function SupplementUpload({ slug, number }: { slug: string; number: number }) {
  const [lines, setLines] = useState<Line[]>([]);
  const { mutate } = useSWRConfig();

  function onResult({ fileName, status, body }: UploadOutcome) {
    const ok = status >= 200 && status < 300;
    const text = ok
      ? "attached."
      : status === 0
        ? "did not reach the server; check the connection and try again."
        : `was not stored: ${toApiError(status, body).message}`;
    setLines((prev) => [{ fileName, ok, text }, ...prev].slice(0, 10));
    if (ok) void mutate(filesKey(slug, number));
  }

  return (
    <div className="space-y-3">
      <UploadWidget
        id={`supplement-upload-v${number}`}
        endpoint={`/api/v1/models/${encodeURIComponent(slug)}/versions/${number}/files`}
        fieldName="file"
        restrictions={{ maxFileSize: SUPPLEMENT_MAX_BYTES, maxNumberOfFiles: 10, allowedFileTypes: SUPPLEMENT_ACCEPT }}
        note={SUPPLEMENT_NOTE}
        onResult={onResult}
        height={200}
        dropText="Drop data, a PDF or an archive here, or %{browseFiles}"
      />
      {lines.length > 0 && (
        <ul aria-live="polite" className="space-y-1 text-sm" data-testid="supplement-upload-result">
          {lines.map((l, i) => (
            <li key={i} className={l.ok ? "text-confirmed" : "text-danger"}>
              <strong>{l.fileName}</strong> {l.text}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
