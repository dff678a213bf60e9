"use client";
/** Re-renders the server page every few seconds while `active` (a re-run still going), then stops. */
import { useRouter } from "next/navigation";
import { useEffect } from "react";

export function RefreshWhile({ active, everyMs = 4000 }: { active: boolean; everyMs?: number }) {
  const router = useRouter();
  useEffect(() => {
    if (!active) return;
    const t = window.setInterval(() => router.refresh(), everyMs);
    return () => window.clearInterval(t);
  }, [active, everyMs, router]);
  return null;
}
