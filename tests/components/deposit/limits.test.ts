import { describe, expect, it } from "vitest";
import * as client from "@/components/deposit/limits";
import * as server from "@/lib/storage";

describe("upload limits", () => {
  it("are the same in the browser widgets and on the server", () => {
    expect(client.SPEC_MAX_BYTES).toBe(server.SPEC_MAX_BYTES);
    expect(client.SUPPLEMENT_MAX_BYTES).toBe(server.SUPPLEMENT_MAX_BYTES);
    const serverExtensions = server.UPLOAD_TYPES.supplement.map((t) => t.extension).sort();
    expect(client.SUPPLEMENT_ACCEPT.filter((a) => a.startsWith(".")).sort()).toEqual(serverExtensions);
    expect(client.SPEC_ACCEPT.filter((a) => a.startsWith("."))).toEqual(server.UPLOAD_TYPES.spec.map((t) => t.extension));
  });
});
