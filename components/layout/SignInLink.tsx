"use client";
import { usePathname } from "next/navigation";
import { buttonClass } from "@/components/ui/Button";

/** "Sign in" that brings the visitor back to the page they were refused. */
export function SignInLink() {
  const path = usePathname();
  return (
    <a href={`/sign-in?next=${encodeURIComponent(path)}`} className={buttonClass("primary")}>
      Sign in
    </a>
  );
}
