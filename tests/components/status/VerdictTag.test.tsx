/** A verdict is never shown by colour alone: every tag carries its word and an icon. */
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { isVerdict, VERDICT_STYLES, VERDICT_VALUES, VerdictTag } from "@/components/status/VerdictTag";

describe("VerdictTag", () => {
  it.each(VERDICT_VALUES)("%s shows its word, an icon and a meaning", (verdict) => {
    const html = renderToStaticMarkup(<VerdictTag verdict={verdict} />).replace(/&#x27;/g, "'");
    expect(html).toContain(`>${VERDICT_STYLES[verdict].word}<`);
    expect(html).toContain("<svg");
    expect(html).toContain(`data-verdict="${verdict}"`);
    expect(html).toContain(`title="${VERDICT_STYLES[verdict].meaning}"`);
  });

  it("keeps the icon beside a custom label", () => {
    const html = renderToStaticMarkup(<VerdictTag verdict="inconclusive" label="2 inconclusive" />);
    expect(html).toContain(">2 inconclusive<");
    expect(html).toContain("<svg");
  });

  it("has four distinct words and icons", () => {
    const words = new Set(VERDICT_VALUES.map((v) => VERDICT_STYLES[v].word));
    const icons = new Set(VERDICT_VALUES.map((v) => VERDICT_STYLES[v].Icon));
    expect(words.size).toBe(4);
    expect(icons.size).toBe(4);
  });

  it("recognises verdict strings", () => {
    expect(isVerdict("confirmed")).toBe(true);
    expect(isVerdict("Confirmed")).toBe(false);
    expect(isVerdict(3)).toBe(false);
  });
});
