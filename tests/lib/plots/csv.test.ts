import { describe, expect, it } from "vitest";
import { csvField, toCsv, trajectoryCsv } from "@/lib/plots/csv";

// Quoting rules: RFC 4180 section 2.
describe("csvField", () => {
  it("leaves plain text and numbers bare", () => {
    expect(csvField("Hawk")).toBe("Hawk");
    expect(csvField(0.1)).toBe("0.1");
  });
  it("writes numbers at full round-trip precision", () => {
    expect(csvField(1 / 3)).toBe("0.3333333333333333");
    expect(Number(csvField(0.1 + 0.2))).toBe(0.1 + 0.2);
    expect(csvField(1e-20)).toBe("1e-20");
    expect(csvField(NaN)).toBe("");
  });
  it("quotes fields with commas, quotes, line breaks or edge spaces, doubling inner quotes", () => {
    expect(csvField("a,b")).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField("two\nlines")).toBe('"two\nlines"');
    expect(csvField(" padded")).toBe('" padded"');
  });
  it("defuses text a spreadsheet would run as a formula (OWASP CSV injection advice)", () => {
    expect(csvField("=HYPERLINK(1)")).toBe("'=HYPERLINK(1)");
    expect(csvField("+1")).toBe("'+1");
    expect(csvField("-x")).toBe("'-x");
    expect(csvField("@sum")).toBe("'@sum");
    expect(csvField("=a,b")).toBe(`"'=a,b"`);
    // Numbers are never altered, negative ones included.
    expect(csvField(-0.5)).toBe("-0.5");
  });
});

describe("toCsv / trajectoryCsv", () => {
  it("writes a header row and CRLF line ends", () => {
    expect(toCsv(["time", "A"], [[0, 1]])).toBe("time,A\r\n0,1\r\n");
  });
  it("writes one line per sample, with a run column when asked", () => {
    const blocks = [
      { run: "r1", times: [0, 1], rows: [[1, 0], [0.5, 0.5]] },
      { run: "r2", times: [0], rows: [[0, 1]] },
    ];
    expect(trajectoryCsv(["Forager", 'Say "no"'], blocks, true)).toBe(
      'run,time,Forager,"Say ""no"""\r\nr1,0,1,0\r\nr1,1,0.5,0.5\r\nr2,0,0,1\r\n',
    );
    expect(trajectoryCsv(["A", "B"], blocks.slice(0, 1), false)).toBe("time,A,B\r\n0,1,0\r\n1,0.5,0.5\r\n");
  });
});
