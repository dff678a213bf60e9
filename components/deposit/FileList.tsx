"use client";
/** A version's files with download links; refreshed after each upload through its SWR key. */
import useSWR from "swr";
import type { FileInfo } from "@/lib/types/deposit";
import { fetchJson } from "./api-client";
import { filesKey } from "./keys";

export function formatBytes(n: number): string {
  if (n >= 1_000_000) return `${(n / 1_000_000).toFixed(1)} MB`;
  if (n >= 1000) return `${(n / 1000).toFixed(1)} kB`;
  return `${n} bytes`;
}

const KIND: Record<string, string> = {
  "application/json": "Specification (JSON)",
  "text/csv": "CSV",
  "text/plain": "Plain text",
  "application/pdf": "PDF",
  "application/zip": "ZIP",
};

export function FileList({ slug, number, initial }: { slug: string; number: number; initial: FileInfo[] }) {
  const { data } = useSWR<{ files: FileInfo[] }>(filesKey(slug, number), fetchJson, { fallbackData: { files: initial } });
  const files = data?.files ?? initial;
  return (
    <ul className="divide-y divide-line rounded-[var(--radius-card)] border border-line" data-testid="file-list">
      {files.map((f) => (
        <li key={f.id} className="flex flex-wrap items-baseline justify-between gap-2 px-4 py-2 text-sm">
          <a className="rp-link font-medium break-all" href={`/api/v1/files/${f.id}`} download={f.originalName}>
            {f.originalName}
          </a>
          <span className="text-xs text-ink-faint">
            {f.purpose === "spec" ? "Specification" : (KIND[f.mediaType] ?? f.mediaType)} · {formatBytes(f.size)} ·{" "}
            <span className="font-mono" title={`SHA-256 ${f.sha256}`}>
              {f.sha256.slice(0, 12)}
            </span>
          </span>
        </li>
      ))}
    </ul>
  );
}
