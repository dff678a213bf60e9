import { describe, expect, it } from "vitest";
import { badgeSnippets, badgeUrls } from "@/components/badge/BadgeSnippets";

describe("badgeSnippets", () => {
  it("links the version badge to the version's public page", () => {
    const s = badgeSnippets("rp-7f3k2q", 3, "https://restpoint.example/");
    expect(s.markdown).toBe(
      "[![Restpoint badge of model rp-7f3k2q, version 3](https://restpoint.example/badges/models/rp-7f3k2q/v/3.svg)](https://restpoint.example/models/rp-7f3k2q/v/3)",
    );
    expect(s.html).toBe(
      '<a href="https://restpoint.example/models/rp-7f3k2q/v/3"><img src="https://restpoint.example/badges/models/rp-7f3k2q/v/3.svg" alt="Restpoint badge of model rp-7f3k2q, version 3" height="40"></a>',
    );
  });

  it("uses the model badge without a version, and escapes what goes into attributes", () => {
    expect(badgeUrls("rp-abc", undefined, "http://h").image).toBe("http://h/badges/models/rp-abc.svg");
    const s = badgeSnippets('rp-"x', undefined, 'http://h?a=1&b="2"');
    expect(s.html).not.toContain('"2"');
    expect(s.html).toContain("&amp;b=&quot;2&quot;");
  });
});
