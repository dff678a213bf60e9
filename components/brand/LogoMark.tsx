/**
 * Restpoint's mark: a trajectory spiralling in to a stable rest point (half-circle arcs of
 * shrinking radius about two alternating centres), the rest point drawn in ochre.
 */
export function LogoMark({ size = 28, title }: { size?: number; title?: string }) {
  return (
    <svg
      width={size}
      height={size}
      viewBox="0 0 32 32"
      role={title === undefined ? undefined : "img"}
      aria-hidden={title === undefined ? true : undefined}
      aria-label={title}
      fill="none"
    >
      <rect x="1" y="1" width="30" height="30" rx="8" className="fill-tide" />
      <path
        d="M5 16 A11 11 0 0 1 27 16 A9 9 0 0 1 9 16 A7 7 0 0 1 23 16 A5 5 0 0 1 13 16 A3 3 0 0 1 19 16"
        stroke="var(--rp-on-tide)"
        strokeWidth="1.9"
        strokeLinecap="round"
      />
      <circle cx="17.4" cy="16" r="2.3" className="fill-ochre" stroke="var(--rp-on-tide)" strokeWidth="1" />
    </svg>
  );
}

export function Wordmark({ size = 28 }: { size?: number }) {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark size={size} />
      <span className="text-lg font-semibold tracking-tight text-ink">Restpoint</span>
    </span>
  );
}
