/**
 * Rules for account forms, shared by the browser forms and the server (lib/auth.ts checks
 * every sign-up and password change with the same functions), so both say the same thing.
 */
import { z } from "zod";

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 128;

export const MESSAGES = {
  nameMissing: "Enter your name as it should appear on your models.",
  nameTooLong: "Keep your name under 100 characters.",
  emailMalformed: "Enter an e-mail address such as name@example.org.",
  passwordShort: `Use at least ${PASSWORD_MIN} characters for your password.`,
  passwordLong: `Use at most ${PASSWORD_MAX} characters for your password.`,
  passwordCommon: "This password is too easy to guess. Choose one that others are unlikely to use.",
  passwordHasEmail: "Your password must not contain your e-mail address.",
  emailTaken: "An account with this e-mail address already exists. Sign in, or reset your password if you forgot it.",
} as const;

// Passwords that appear at the top of every leaked-password list (common practice to refuse them).
const COMMON = new Set([
  "password", "password1", "password12", "password123", "passw0rd", "1234567890", "12345678910",
  "qwertyuiop", "1q2w3e4r5t", "iloveyou12", "letmein123", "welcome123", "administrator",
  "0987654321", "1111111111", "abcdefghij", "qwerty1234", "restpoint1", "restpoint123",
]);

/** The first problem with a password, or null when it is acceptable. */
export function passwordProblem(password: string, email = ""): string | null {
  if (password.length < PASSWORD_MIN) return MESSAGES.passwordShort;
  if (password.length > PASSWORD_MAX) return MESSAGES.passwordLong;
  const lower = password.toLowerCase();
  if (COMMON.has(lower) || /^(.)\1+$/.test(password)) return MESSAGES.passwordCommon;
  const local = email.toLowerCase().split("@")[0] ?? "";
  if (local.length >= 4 && lower.includes(local)) return MESSAGES.passwordHasEmail;
  return null;
}

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ error: MESSAGES.emailMalformed }));

export const signUpSchema = z
  .object({
    name: z.string().trim().min(1, { error: MESSAGES.nameMissing }).max(100, { error: MESSAGES.nameTooLong }),
    email: emailSchema,
    password: z.string(),
  })
  .superRefine((v, ctx) => {
    const problem = passwordProblem(v.password, v.email);
    if (problem !== null) ctx.addIssue({ code: "custom", path: ["password"], message: problem });
  });

export type SignUpInput = z.infer<typeof signUpSchema>;

/** Field name -> first message, for showing beside form fields. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? "form");
    out[key] ??= issue.message;
  }
  return out;
}
