"use client";
/** Copies a text to the clipboard and says so (in words, for screen readers too). */
import { useState } from "react";
import { buttonClass } from "@/components/ui/Button";

export function CopyButton({ text, label }: { text: string; label: string }) {
  const [state, setState] = useState<"idle" | "copied" | "failed">("idle");
  async function copy() {
    try {
      await navigator.clipboard.writeText(text);
      setState("copied");
    } catch {
      // Clipboard access needs a secure context; the text stays selectable beside the button.
      setState("failed");
    }
    window.setTimeout(() => setState("idle"), 2500);
  }
  return (
    <button type="button" onClick={copy} className={buttonClass("secondary", "px-3 py-1 text-xs")} aria-live="polite">
      {state === "copied" ? "Copied" : state === "failed" ? "Select and copy the text" : label}
    </button>
  );
}
