/** Buttons and button-looking links in three strengths; `buttonClass` styles anything else. */
import Link from "next/link";
import type { ButtonHTMLAttributes, ComponentProps } from "react";

export type ButtonKind = "primary" | "secondary" | "quiet" | "danger";

const base =
  "inline-flex items-center justify-center gap-2 rounded-[var(--radius-control)] px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-60";
const kinds: Record<ButtonKind, string> = {
  primary: "bg-tide text-on-tide hover:bg-tide-strong",
  secondary: "border border-line-strong bg-surface text-ink hover:border-tide hover:text-tide",
  quiet: "text-tide hover:bg-tide-wash",
  danger: "border border-danger/50 bg-surface text-danger hover:bg-danger-wash",
};

export function buttonClass(kind: ButtonKind = "primary", extra = ""): string {
  return `${base} ${kinds[kind]} ${extra}`;
}

export function Button({ kind = "primary", className = "", ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { kind?: ButtonKind }) {
  return <button className={buttonClass(kind, className)} {...rest} />;
}

export function ButtonLink({ kind = "primary", className = "", ...rest }: ComponentProps<typeof Link> & { kind?: ButtonKind }) {
  return <Link className={buttonClass(kind, className)} {...rest} />;
}
