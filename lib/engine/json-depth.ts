/**
 * Nesting depth of parsed JSON, measured without recursion so that hostile depth cannot
 * overflow the stack. No Node imports: validation runs in the browser too.
 */

/** Inputs nested deeper than this are refused by validation (a model spec needs about 6 levels). */
export const MAX_DEPTH = 64;

/** Nesting depth of a JSON value (0 for a scalar); stops counting once above `limit`. */
export function jsonDepth(value: unknown, limit = Infinity): number {
  let max = 0;
  const stack: [unknown, number][] = [[value, 1]];
  while (stack.length > 0) {
    const top = stack.pop();
    if (top === undefined) break;
    const [v, d] = top;
    if (v === null || typeof v !== "object") continue;
    if (d > max) max = d;
    if (max > limit) return max;
    const children = Array.isArray(v) ? v : Object.values(v as Record<string, unknown>);
    for (const c of children) if (c !== null && typeof c === "object") stack.push([c, d + 1]);
  }
  return max;
}
