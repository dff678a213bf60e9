import { describe, expect, it } from "vitest";
import { readMailbox, signMailbox } from "@/lib/mailbox";
import { safeNext } from "@/lib/safe-redirect";

describe("mailbox cookie", () => {
  it("round-trips a lower-cased address", () => {
    expect(readMailbox(signMailbox("Ana@Example.org"))).toBe("ana@example.org");
  });
  it("rejects a changed address, a bad signature and garbage", () => {
    const good = signMailbox("ana@example.org");
    const [, sig] = good.split(".");
    expect(readMailbox(`${Buffer.from("admin@restpoint.local").toString("base64url")}.${sig ?? ""}`)).toBeNull();
    expect(readMailbox(`${good}x`)).toBeNull();
    expect(readMailbox("nonsense")).toBeNull();
    expect(readMailbox(undefined)).toBeNull();
  });
});

describe("safeNext", () => {
  it("follows local paths only", () => {
    expect(safeNext("/admin/accounts")).toBe("/admin/accounts");
    expect(safeNext("//evil.example/x")).toBe("/workspace");
    expect(safeNext("/\\evil.example")).toBe("/workspace");
    expect(safeNext("https://evil.example")).toBe("/workspace");
    expect(safeNext(undefined, "/")).toBe("/");
    expect(safeNext(["/a", "/b"])).toBe("/a");
  });
});
