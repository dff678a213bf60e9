/**
 * The demo accounts, one per role. Their passwords are public on purpose: they are printed in
 * the README and on the sign-in page in development and demo mode, never anywhere else.
 */
import type { Role } from "@/db/schema";

export interface DemoAccount {
  role: Role;
  name: string;
  email: string;
  password: string;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { role: "author", name: "Noor Varga", email: "author@restpoint.local", password: "reef-writer-2026" },
  { role: "editor", name: "Tomas Ekwueme", email: "editor@restpoint.local", password: "reef-judge-2026" },
  { role: "admin", name: "Rhea Lindqvist", email: "admin@restpoint.local", password: "reef-warden-2026" },
];

export function demoAccount(role: Role): DemoAccount {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role);
  if (a === undefined) throw new Error(`no demo account for role ${role}`);
  return a;
}

/** The fictional venue the demo editor works for. */
export const DEMO_VENUE = {
  slug: "tidewater-letters",
  name: "Tidewater Letters in Behavioural Ecology",
  description:
    "A fictional open collection of short models on foraging, signalling and territory along tidal shores, used to show how Restpoint works.",
} as const;
