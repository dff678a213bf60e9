/**
 * Where JSON text first goes wrong. JSON.parse says that it failed but, on Node 20, not
 * always where; this scanner follows the JSON grammar (RFC 8259) without recursion and
 * returns the offset of the first character that cannot continue a valid document.
 */

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const ESCAPES = new Set(['"', "\\", "/", "b", "f", "n", "r", "t"]);

/** Offset of the first offending character, or -1 when the text is valid JSON. */
export function jsonErrorOffset(t: string): number {
  const n = t.length;
  let i = 0;
  const stack: string[] = [];
  let mode: "value" | "after" | "key" | "colon" = "value";
  const ws = (): void => {
    while (i < n) {
      const c = t.charCodeAt(i);
      if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d) i++;
      else break;
    }
  };
  const string = (): boolean => {
    i++; // opening quote
    while (i < n) {
      const c = t[i] ?? "";
      if (c === '"') {
        i++;
        return true;
      }
      if (c === "\\") {
        const e = t[i + 1] ?? "";
        if (e === "u") {
          if (!/^[0-9a-fA-F]{4}$/.test(t.slice(i + 2, i + 6))) return false;
          i += 6;
          continue;
        }
        if (!ESCAPES.has(e)) return false;
        i += 2;
        continue;
      }
      if (c.charCodeAt(0) < 0x20) return false;
      i++;
    }
    return false;
  };
  for (;;) {
    ws();
    if (mode === "value") {
      const c = t[i];
      if (c === "{" || c === "[") {
        stack.push(c);
        i++;
        ws();
        if (t[i] === (c === "{" ? "}" : "]")) {
          stack.pop();
          i++;
          mode = "after";
        } else mode = c === "{" ? "key" : "value";
      } else if (c === '"') {
        if (!string()) return Math.min(i, n);
        mode = "after";
      } else if (t.startsWith("true", i) || t.startsWith("null", i)) {
        i += 4;
        mode = "after";
      } else if (t.startsWith("false", i)) {
        i += 5;
        mode = "after";
      } else {
        NUMBER.lastIndex = i;
        const m = NUMBER.exec(t);
        if (m === null || m[0] === "") return i;
        i += m[0].length;
        mode = "after";
      }
    } else if (mode === "key") {
      if (t[i] !== '"' || !string()) return Math.min(i, n);
      mode = "colon";
    } else if (mode === "colon") {
      if (t[i] !== ":") return i;
      i++;
      mode = "value";
    } else {
      const top = stack[stack.length - 1];
      if (top === undefined) return i === n ? -1 : i;
      const c = t[i];
      if (c === ",") {
        i++;
        mode = top === "{" ? "key" : "value";
      } else if ((top === "[" && c === "]") || (top === "{" && c === "}")) {
        stack.pop();
        i++;
      } else return i;
    }
  }
}

/** 1-based line and column of an offset. */
export function lineAndColumn(t: string, offset: number): { line: number; column: number } {
  const before = t.slice(0, offset);
  const line = before.split("\n").length;
  return { line, column: offset - before.lastIndexOf("\n") };
}
