/**
 * Payoff entries: finite numbers or expressions over the spec's parameters.
 *
 * An expression is parsed once by mathjs and then walked by our own evaluator, which
 * accepts only numeric constants, the parameters (plus `pi` and `e`), arithmetic
 * operators, parentheses and a fixed list of elementary functions. mathjs' own `evaluate`
 * is never called, so nothing an author writes can reach assignment, function definition,
 * `import`, `createUnit`, property access or any other part of mathjs.
 */
import {
  isConstantNode,
  isFunctionNode,
  isOperatorNode,
  isParenthesisNode,
  isSymbolNode,
  parse,
  type MathNode,
} from "mathjs/number";
import type { CompiledGame, GameSpec, Parameters, PayoffEntry } from "./types";

/** Longest payoff expression accepted, in characters. */
export const MAX_EXPRESSION_LENGTH = 500;

/** A payoff expression the engine refuses; `path` is the JSON pointer of the entry. */
export class PayoffError extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message);
    this.name = "PayoffError";
  }
}

type Compiled = (p: Parameters) => number;

const CONSTANTS: Record<string, number> = { pi: Math.PI, e: Math.E };

/** Elementary functions allowed in expressions, with their admissible argument counts. */
const FUNCTIONS: Record<string, { min: number; max: number; fn: (...a: number[]) => number }> = {
  exp: { min: 1, max: 1, fn: Math.exp },
  log: { min: 1, max: 2, fn: (x, b) => (b === undefined ? Math.log(x) : Math.log(x) / Math.log(b)) },
  ln: { min: 1, max: 1, fn: Math.log },
  log10: { min: 1, max: 1, fn: Math.log10 },
  log2: { min: 1, max: 1, fn: Math.log2 },
  sqrt: { min: 1, max: 1, fn: Math.sqrt },
  cbrt: { min: 1, max: 1, fn: Math.cbrt },
  abs: { min: 1, max: 1, fn: Math.abs },
  sign: { min: 1, max: 1, fn: Math.sign },
  sin: { min: 1, max: 1, fn: Math.sin },
  cos: { min: 1, max: 1, fn: Math.cos },
  tan: { min: 1, max: 1, fn: Math.tan },
  asin: { min: 1, max: 1, fn: Math.asin },
  acos: { min: 1, max: 1, fn: Math.acos },
  atan: { min: 1, max: 1, fn: Math.atan },
  sinh: { min: 1, max: 1, fn: Math.sinh },
  cosh: { min: 1, max: 1, fn: Math.cosh },
  tanh: { min: 1, max: 1, fn: Math.tanh },
  floor: { min: 1, max: 1, fn: Math.floor },
  ceil: { min: 1, max: 1, fn: Math.ceil },
  round: { min: 1, max: 1, fn: Math.round },
  min: { min: 1, max: 24, fn: Math.min },
  max: { min: 1, max: 24, fn: Math.max },
  pow: { min: 2, max: 2, fn: Math.pow },
};

/** Names of the functions payoff expressions may call, sorted (for messages and documentation). */
export const ALLOWED_FUNCTIONS: readonly string[] = Object.keys(FUNCTIONS).sort();

const BINARY: Record<string, (a: number, b: number) => number> = {
  add: (a, b) => a + b,
  subtract: (a, b) => a - b,
  multiply: (a, b) => a * b,
  divide: (a, b) => a / b,
  pow: (a, b) => Math.pow(a, b),
};

/** Names of node kinds in words, for messages. */
const NODE_WORDS: Record<string, string> = {
  AssignmentNode: "assignment",
  FunctionAssignmentNode: "function definition",
  AccessorNode: "property or index access",
  IndexNode: "property or index access",
  ArrayNode: "matrices or lists",
  ObjectNode: "objects",
  BlockNode: "several statements",
  ConditionalNode: "conditional expressions",
  RangeNode: "ranges",
  RelationalNode: "comparisons",
};

const FORBIDDEN_FUNCTIONS = new Set(["import", "evaluate", "parse", "compile", "createUnit", "simplify", "derivative", "config", "chain", "help", "reviver", "replacer"]);

function walk(node: MathNode, path: string, known: ReadonlySet<string>): Compiled {
  if (isParenthesisNode(node)) return walk(node.content, path, known);
  if (isConstantNode(node)) {
    const v: unknown = node.value;
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new PayoffError(path, "Only numbers may appear as constants in a payoff expression (no strings or other values).");
    }
    return () => v;
  }
  if (isSymbolNode(node)) {
    const name = node.name;
    if (known.has(name)) return (p) => p[name] ?? Number.NaN;
    const c = CONSTANTS[name];
    if (c !== undefined) return () => c;
    if (name in FUNCTIONS) {
      throw new PayoffError(path, `"${name}" is a function and must be called with an argument, as in ${name}(x).`);
    }
    throw new PayoffError(path, `The expression uses "${name}", which is not one of the spec's parameters${known.size > 0 ? ` (${[...known].sort().join(", ")})` : " (the spec defines none)"}.`);
  }
  if (isOperatorNode(node)) {
    const fn: string = node.fn;
    const args = node.args.map((a) => walk(a, path, known));
    if (args.length === 1) {
      const [a] = args;
      if (a === undefined) throw new PayoffError(path, "Malformed operator in the payoff expression.");
      if (fn === "unaryMinus") return (p) => -a(p);
      if (fn === "unaryPlus") return a;
    } else if (args.length === 2) {
      const [a, b] = args;
      const op = BINARY[fn];
      if (op !== undefined && a !== undefined && b !== undefined) return (p) => op(a(p), b(p));
    }
    throw new PayoffError(path, `The operator "${node.op}" is not allowed in payoff expressions; use + - * / ^ and parentheses.`);
  }
  if (isFunctionNode(node)) {
    const callee = node.fn as MathNode;
    if (!isSymbolNode(callee)) {
      throw new PayoffError(path, "Only the elementary functions may be called in a payoff expression.");
    }
    const name = callee.name;
    const spec = FUNCTIONS[name];
    if (spec === undefined) {
      const why = FORBIDDEN_FUNCTIONS.has(name) ? ` "${name}" would reach beyond the payoff arithmetic and is refused.` : "";
      throw new PayoffError(path, `The function "${name}" is not allowed in payoff expressions.${why} Allowed functions: ${ALLOWED_FUNCTIONS.join(", ")}.`);
    }
    if (node.args.length < spec.min || node.args.length > spec.max) {
      throw new PayoffError(path, `The function "${name}" takes ${spec.min === spec.max ? spec.min : `${spec.min} to ${spec.max}`} argument${spec.max === 1 ? "" : "s"}, not ${node.args.length}.`);
    }
    const args = node.args.map((a) => walk(a, path, known));
    const f = spec.fn;
    const buf = new Array<number>(args.length);
    return (p) => {
      for (let i = 0; i < args.length; i++) {
        const g = args[i];
        buf[i] = g === undefined ? Number.NaN : g(p);
      }
      return f(...buf);
    };
  }
  const word = NODE_WORDS[node.type] ?? node.type;
  throw new PayoffError(path, `Payoff expressions may not contain ${word}; only arithmetic over the parameters is allowed.`);
}

/**
 * Compiles one expression string. Throws PayoffError (with `path`) when the text is too
 * long, does not parse, or uses anything beyond arithmetic, the elementary functions and
 * the names in `known`.
 */
export function compileExpression(text: string, path: string, known: ReadonlySet<string>): Compiled {
  if (text.length > MAX_EXPRESSION_LENGTH) {
    throw new PayoffError(path, `The expression is ${text.length} characters long; payoff expressions are limited to ${MAX_EXPRESSION_LENGTH} characters.`);
  }
  if (text.trim() === "") throw new PayoffError(path, "The payoff expression is empty.");
  let node: MathNode;
  try {
    node = parse(text);
  } catch (e) {
    const detail = e instanceof Error ? e.message : String(e);
    throw new PayoffError(path, `The payoff expression could not be read: ${detail}.`);
  }
  return walk(node, path, known);
}

/** Evaluates one payoff entry; throws PayoffError when the result is NaN or infinite. */
export function evaluateEntry(entry: PayoffEntry, path: string, params: Parameters, known: ReadonlySet<string>): number {
  const value = typeof entry === "number" ? entry : compileExpression(entry, path, known)(params);
  if (!Number.isFinite(value)) {
    const what = Number.isNaN(value) ? "is not a number (NaN)" : "is infinite";
    throw new PayoffError(path, `The payoff ${typeof entry === "string" ? `"${entry}" ` : ""}${what} at the parameter values ${describeParameters(params)}.`);
  }
  return value;
}

function describeParameters(p: Parameters): string {
  const keys = Object.keys(p).sort();
  return keys.length === 0 ? "(none)" : keys.map((k) => `${k} = ${p[k]}`).join(", ");
}

function evaluateMatrix(rows: PayoffEntry[][], base: string, params: Parameters, known: ReadonlySet<string>, r: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) {
    const row = rows[i];
    if (row === undefined || row.length !== c) throw new PayoffError(`${base}/${i}`, `Row ${i + 1} must have ${c} entries.`);
    for (let j = 0; j < c; j++) {
      const entry = row[j];
      if (entry === undefined) throw new PayoffError(`${base}/${i}/${j}`, "Missing payoff entry.");
      out[i * c + j] = evaluateEntry(entry, `${base}/${i}/${j}`, params, known);
    }
  }
  return out;
}

/**
 * Evaluates the game's payoffs at the spec's parameters overlaid with `overrides`.
 * The matrix shapes are assumed checked (validate.ts); a wrong shape still throws
 * PayoffError rather than producing a malformed game.
 */
export function compileGame(spec: { parameters?: Parameters; game: GameSpec }, overrides?: Parameters): CompiledGame {
  const params: Parameters = { ...(spec.parameters ?? {}), ...(overrides ?? {}) };
  const known = new Set(Object.keys(params));
  const game = spec.game;
  if (game.kind === "symmetric") {
    const n = game.strategies.length;
    if (game.payoffs.length !== n) throw new PayoffError("/game/payoffs", `The payoff matrix must have ${n} rows.`);
    const A = evaluateMatrix(game.payoffs, "/game/payoffs", params, known, n, n);
    return { kind: "symmetric", n, strategies: [...game.strategies], A };
  }
  const [p1, p2] = game.populations;
  const m = p1.strategies.length;
  const k = p2.strategies.length;
  const [P1, P2] = game.payoffs;
  if (P1.length !== m) throw new PayoffError("/game/payoffs/0", `The first population's payoff matrix must have ${m} rows.`);
  if (P2.length !== k) throw new PayoffError("/game/payoffs/1", `The second population's payoff matrix must have ${k} rows.`);
  const A = evaluateMatrix(P1, "/game/payoffs/0", params, known, m, k);
  const B = evaluateMatrix(P2, "/game/payoffs/1", params, known, k, m);
  return { kind: "bimatrix", m, k, populations: [p1, p2], A, B };
}
