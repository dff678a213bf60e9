/** The account form rules shared by the browser and the server. */
import { describe, expect, it } from "vitest";
import { fieldErrors, MESSAGES, passwordProblem, signUpSchema } from "@/lib/account-rules";

describe("passwordProblem", () => {
  it("accepts a long enough, uncommon password", () => {
    expect(passwordProblem("heron-marsh-lantern", "ana@example.org")).toBeNull();
  });
  it("names each problem", () => {
    expect(passwordProblem("abc")).toBe(MESSAGES.passwordShort);
    expect(passwordProblem("x".repeat(129))).toBe(MESSAGES.passwordLong);
    expect(passwordProblem("Password123")).toBe(MESSAGES.passwordCommon);
    expect(passwordProblem("zzzzzzzzzzzz")).toBe(MESSAGES.passwordCommon);
    expect(passwordProblem("my-marisol-pass", "Marisol@example.org")).toBe(MESSAGES.passwordHasEmail);
  });
  it("allows a short local part inside the password (too many false alarms otherwise)", () => {
    expect(passwordProblem("ana-heron-marsh", "ana@example.org")).toBeNull();
  });
});

describe("signUpSchema", () => {
  it("normalises the address and keeps the fields", () => {
    expect(signUpSchema.parse({ name: " Ana ", email: " Ana@Example.ORG ", password: "heron-marsh-lantern" })).toEqual({
      name: "Ana",
      email: "ana@example.org",
      password: "heron-marsh-lantern",
    });
  });
  it("reports one message per field", () => {
    const r = signUpSchema.safeParse({ name: "", email: "nope", password: "short" });
    expect(r.success).toBe(false);
    if (!r.success) {
      expect(fieldErrors(r.error)).toEqual({ name: MESSAGES.nameMissing, email: MESSAGES.emailMalformed, password: MESSAGES.passwordShort });
    }
    const p = signUpSchema.safeParse({ name: "Ana", email: "ana@example.org", password: "short" });
    expect(p.success).toBe(false);
    if (!p.success) expect(fieldErrors(p.error)).toEqual({ password: MESSAGES.passwordShort });
  });
});
