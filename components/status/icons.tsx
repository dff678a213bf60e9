/** Small line icons (16 px grid) used beside status words; decorative, so hidden from screen readers. */
import type { ReactNode } from "react";

function Icon({ children, className = "" }: { children: ReactNode; className?: string }) {
  return (
    <svg viewBox="0 0 16 16" width="1em" height="1em" aria-hidden="true" className={`shrink-0 ${className}`} fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round">
      {children}
    </svg>
  );
}

export const CheckIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <circle cx="8" cy="8" r="6.5" />
    <path d="M5 8.2 7.1 10.3 11 6" />
  </Icon>
);
export const CrossIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <path d="M8 1.5 14.5 8 8 14.5 1.5 8Z" />
    <path d="M6 6l4 4M10 6l-4 4" />
  </Icon>
);
export const QuestionIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <path d="M8 1.8 14.4 13.6H1.6Z" />
    <path d="M6.3 7.2a1.8 1.8 0 1 1 2.4 1.7c-.5.2-.7.5-.7 1v.3" />
    <path d="M8 12.1h.01" />
  </Icon>
);
export const BrokenIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <rect x="2" y="2" width="12" height="12" rx="2" />
    <path d="M2.5 13.5 13.5 2.5" />
  </Icon>
);
export const InfoIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <circle cx="8" cy="8" r="6.5" />
    <path d="M8 7.2v4M8 4.8h.01" />
  </Icon>
);
export const ClockIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <circle cx="8" cy="8" r="6.5" />
    <path d="M8 4.5V8l2.4 1.6" />
  </Icon>
);
export const MailIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <rect x="1.8" y="3.3" width="12.4" height="9.4" rx="1.5" />
    <path d="m2.3 4.2 5.7 4.4 5.7-4.4" />
  </Icon>
);
export const LockIcon = ({ className }: { className?: string }) => (
  <Icon className={className}>
    <rect x="3" y="7" width="10" height="7" rx="1.5" />
    <path d="M5.3 7V5a2.7 2.7 0 0 1 5.4 0v2" />
  </Icon>
);
