import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { AreaError } from "@/components/ui/AreaError";

describe("AreaError", () => {
  it("names what failed, quotes the log reference and offers a retry", () => {
    const error = Object.assign(new Error("boom"), { digest: "d1g35t" });
    const html = renderToStaticMarkup(<AreaError title="This part of your workspace could not be loaded." error={error} reset={() => {}} />);
    expect(html).toContain("This part of your workspace could not be loaded.");
    expect(html).toContain("The error was logged (d1g35t). Your data is unchanged.");
    expect(html).toContain("Try again");
    expect(html).not.toContain("boom");
  });

  it("leaves out the reference when there is none", () => {
    const html = renderToStaticMarkup(<AreaError title="t" error={new Error("x")} reset={() => {}} />);
    expect(html).toContain("The error was logged. Your data is unchanged.");
  });
});
