/** A labelled form field with its hint and error, wired for screen readers (aria-describedby). */
import type { InputHTMLAttributes } from "react";

export function Field({
  label,
  name,
  error,
  hint,
  ...input
}: InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; error?: string; hint?: string }) {
  const id = input.id ?? `field-${name}`;
  const describedBy = [hint === undefined ? null : `${id}-hint`, error === undefined ? null : `${id}-error`].filter((x) => x !== null).join(" ");
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <input id={id} name={name} className="rp-input" aria-invalid={error === undefined ? undefined : true} aria-describedby={describedBy === "" ? undefined : describedBy} {...input} />
      {hint === undefined ? null : (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      )}
      {error === undefined ? null : (
        <p id={`${id}-error`} className="text-sm text-danger" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}
