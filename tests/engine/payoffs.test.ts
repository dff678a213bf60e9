import { describe, expect, it } from "vitest";
import { compileExpression, compileGame, evaluateEntry, PayoffError } from "@/lib/engine/payoffs";
import { expectClose } from "../support/close";

const known = new Set(["V", "C", "b", "c"]);
const params = { V: 2, C: 3, b: 4, c: 1 };

function refusal(text: string, names: ReadonlySet<string> = known): PayoffError {
  try {
    compileExpression(text, "/game/payoffs/0/1", names)(params);
  } catch (e) {
    if (e instanceof PayoffError) return e;
    throw e;
  }
  throw new Error(`"${text}" was accepted`);
}

describe("payoff expressions: what is allowed", () => {
  it.each([
    ["(V - C) / 2", -0.5],
    ["V", 2],
    ["-V + 1", -1],
    ["+V", 2],
    ["V^2 - 2^-1", 3.5],
    ["b - c", 3],
    ["2 V", 4], // implicit multiplication is arithmetic
    ["exp(0) + log(e) + sqrt(16) + abs(-2)", 8],
    ["sin(pi / 2) + cos(0) + tan(0)", 2],
    ["min(V, C) + max(V, C, 10)", 12],
    ["log(8, 2)", 3],
    ["1e-3 * 1000", 1],
  ])("%s = %d", (text, value) => {
    expectClose(compileExpression(text, "/p", known)(params), value, 1e-14, 1e-15);
  });

  it("lets a parameter named like a constant shadow the constant", () => {
    expect(compileExpression("e + 1", "/p", new Set(["e"]))({ e: 10 })).toBe(11);
  });
});

describe("payoff expressions: hostile input is refused with a clear error", () => {
  it.each([
    ["V = 3", /may not contain assignment/],
    ["f(x) = x^2", /may not contain function definition/],
    ['import({}, {override: true})', /The function "import" is not allowed.*would reach beyond/],
    ['evaluate("1+1")', /The function "evaluate" is not allowed/],
    ['parse("1")', /The function "parse" is not allowed/],
    ['createUnit("foo")', /The function "createUnit" is not allowed/],
    ["compile", /uses "compile", which is not one of the spec's parameters/],
    ["V.constructor", /may not contain property or index access/],
    ['V["constructor"]', /may not contain property or index access/],
    ['"a" + "b"', /Only numbers may appear as constants/],
    ["[1, 2]", /may not contain matrices or lists/],
    ["{a: 1}", /may not contain objects/],
    ["V > C ? 1 : 0", /may not contain conditional expressions/],
    ["1:3", /may not contain ranges/],
    ["V; C", /may not contain several statements/],
    ["V == C", /The operator "==" is not allowed/],
    ["V!", /The operator "!" is not allowed/],
    ["V and C", /The operator "and" is not allowed/],
    ["5 cm", /uses "cm", which is not one of the spec's parameters/],
    ['cos.constructor("return 1")', /Only the elementary functions may be called/],
    ["typeOf(V)", /The function "typeOf" is not allowed/],
    ["sqrt", /"sqrt" is a function and must be called/],
    ["sqrt(1, 2)", /The function "sqrt" takes 1 argument, not 2/],
    ["W + 1", /uses "W", which is not one of the spec's parameters \(C, V, b, c\)/],
    ["(1 + ", /could not be read/],
    ["   ", /The payoff expression is empty/],
    ["V + ".repeat(200) + "1", /is 801 characters long; payoff expressions are limited to 500 characters/],
  ])("%s", (text, message) => {
    const e = refusal(text);
    expect(e.message).toMatch(message);
    expect(e.path).toBe("/game/payoffs/0/1");
  });

  it("names the absence of parameters when the spec has none", () => {
    expect(refusal("x", new Set()).message).toMatch(/the spec defines none/);
  });

  it("refuses results that are NaN or infinite, naming the parameter values", () => {
    expect(() => evaluateEntry("V / (C - 3)", "/game/payoffs/1/1", params, known)).toThrow(/The payoff "V \/ \(C - 3\)" is infinite at the parameter values C = 3, V = 2, b = 4, c = 1\./);
    expect(() => evaluateEntry("sqrt(-V)", "/game/payoffs/1/1", params, known)).toThrow(/is not a number \(NaN\)/);
    expect(() => evaluateEntry("1e400", "/x", {}, new Set())).toThrow(/Only numbers may appear/);
    expect(() => evaluateEntry("10^400", "/x", {}, new Set())).toThrow(/is infinite at the parameter values \(none\)/);
  });
});

describe("compileGame", () => {
  it("evaluates a symmetric game at the spec's parameters and at overrides", () => {
    const spec = {
      parameters: { V: 2, C: 3 },
      game: { kind: "symmetric" as const, strategies: ["H", "D"], payoffs: [["(V - C) / 2", "V"], [0, "V / 2"]] },
    };
    const g = compileGame(spec);
    expect(g.kind).toBe("symmetric");
    expect(Array.from(g.A)).toEqual([-0.5, 2, 0, 1]);
    expect(Array.from(compileGame(spec, { C: 4 }).A)).toEqual([-1, 2, 0, 1]);
  });

  it("evaluates both matrices of a two-population game in their own shapes", () => {
    const g = compileGame({
      game: {
        kind: "bimatrix",
        populations: [
          { name: "buyers", strategies: ["a", "b", "c"] },
          { name: "sellers", strategies: ["x", "y"] },
        ],
        payoffs: [
          [[1, 2], [3, 4], [5, 6]],
          [[7, 8, 9], [10, 11, 12]],
        ],
      },
    });
    if (g.kind !== "bimatrix") throw new Error("expected a bimatrix game");
    expect([g.m, g.k]).toEqual([3, 2]);
    expect(Array.from(g.A)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(Array.from(g.B)).toEqual([7, 8, 9, 10, 11, 12]);
  });

  it("reports a wrong shape with the pointer of the row", () => {
    expect(() => compileGame({ game: { kind: "symmetric", strategies: ["a", "b"], payoffs: [[1, 2], [3]] } })).toThrow(/Row 2 must have 2 entries/);
    expect(() => compileGame({ game: { kind: "symmetric", strategies: ["a", "b"], payoffs: [[1, 2]] } })).toThrow(/must have 2 rows/);
  });
});
