/**
 * Header, a centred main column and the footer: the frame of every page, rendered once by the
 * root layout (so the 401/403/404 pages, which Next may render inside any layout, never nest it).
 */
import type { ReactNode } from "react";
import { SiteFooter, SiteHeader } from "./SiteHeader";

export function Shell({ children }: { children: ReactNode }) {
  return (
    <>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-10 focus:rounded focus:bg-surface focus:px-3 focus:py-2">
        Skip to content
      </a>
      <SiteHeader />
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-10 sm:px-6">
        {children}
      </main>
      <SiteFooter />
    </>
  );
}

/** A narrow centred column for short messages (the status pages). */
export function Narrow({ children }: { children: ReactNode }) {
  return <div className="mx-auto w-full max-w-md">{children}</div>;
}

/** A centred card for short forms (sign-in, sign-up, reset). */
export function FormCard({ title, lede, children }: { title: string; lede?: ReactNode; children: ReactNode }) {
  return (
    <div className="mx-auto flex w-full max-w-md flex-col gap-6">
      <div className="flex flex-col gap-2">
        <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
        {lede === undefined ? null : <div className="text-sm text-ink-soft">{lede}</div>}
      </div>
      <div className="rp-card flex flex-col gap-5 p-6 shadow-sm">{children}</div>
    </div>
  );
}
