/**
 * Line numbers for JSON pointers: the engine reports problems as RFC 6901 pointers into the
 * parsed spec; an author editing the file wants the line. This walks the text once (it must
 * be valid JSON already) and records, for every value, the line where it starts, or for an
 * object member the line of its key.
 */

/** Escapes one reference token (RFC 6901 section 3). */
function token(s: string): string {
  return s.replace(/~/g, "~0").replace(/\//g, "~1");
}

/** Deeper than this the walk stops: the engine refuses such nesting anyway, and recursion stays shallow. */
const MAX_WALK_DEPTH = 200;

/** Pointer -> 1-based line, for every value in `text` (valid JSON) up to a nesting of 200. */
export function pointerLines(text: string): Map<string, number> {
  const lines = new Map<string, number>();
  let i = 0;
  let line = 1;

  const skipWhitespace = () => {
    while (i < text.length) {
      const c = text.charCodeAt(i);
      if (c === 0x0a) line += 1;
      else if (c !== 0x20 && c !== 0x09 && c !== 0x0d) return;
      i += 1;
    }
  };

  const readString = (): string => {
    // text[i] is the opening quote; JSON strings hold no raw line breaks.
    const start = i;
    i += 1;
    while (i < text.length && text[i] !== '"') i += text[i] === "\\" ? 2 : 1;
    i += 1;
    return JSON.parse(text.slice(start, i)) as string;
  };

  const value = (pointer: string, depth: number): boolean => {
    skipWhitespace();
    if (!lines.has(pointer)) lines.set(pointer, line);
    const c = text[i];
    if (c === "{" || c === "[") {
      if (depth >= MAX_WALK_DEPTH) return false;
      const close = c === "{" ? "}" : "]";
      i += 1;
      skipWhitespace();
      if (text[i] === close) {
        i += 1;
        return true;
      }
      for (let index = 0; ; index++) {
        skipWhitespace();
        let child: string;
        if (c === "{") {
          const keyLine = line;
          child = `${pointer}/${token(readString())}`;
          lines.set(child, keyLine); // the last duplicate wins, as in JSON.parse
          skipWhitespace();
          i += 1; // ':'
        } else {
          child = `${pointer}/${index}`;
        }
        if (!value(child, depth + 1)) return false;
        skipWhitespace();
        const next = text[i];
        i += 1;
        if (next === close) return true;
        if (next !== ",") return false;
      }
    }
    if (c === '"') {
      readString();
      return true;
    }
    while (i < text.length && !/[\s,\]}]/.test(text[i] ?? "")) i += 1;
    return true;
  };

  value("", 0);
  return lines;
}

/** The line of `pointer`, or of its nearest ancestor present in the text (a missing member points at its parent). */
export function lineOfPointer(lines: Map<string, number>, pointer: string): number | undefined {
  let p = pointer;
  for (;;) {
    const found = lines.get(p);
    if (found !== undefined) return found;
    if (p === "") return undefined;
    p = p.slice(0, p.lastIndexOf("/"));
  }
}

/** 1-based line and column of a character offset. */
export function lineAndColumnAt(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, Math.max(0, Math.min(offset, text.length)));
  const lastBreak = before.lastIndexOf("\n");
  return { line: before.split("\n").length, column: offset - lastBreak };
}
