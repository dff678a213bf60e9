/**
 * Command line: verify one model spec and print its report.
 *
 *   npm run --silent verify -- <spec.json | -> [--json]
 *
 * `-` reads the spec from standard input. With --json, standard output holds exactly one
 * report as JSON; without it, a readable summary. Diagnostics go to standard error only.
 * Exit status: 0 confirmed, 1 contradicted, 3 inconclusive, 2 invalid (also for a file that
 * cannot be read or is not JSON).
 */
import { readFileSync } from "node:fs";
import { refusedInputReport, verifySpecText } from "../lib/engine/verify";
import type { Report, Verdict } from "../lib/engine/types";

const EXIT_STATUS: Record<Verdict, number> = { confirmed: 0, contradicted: 1, invalid: 2, inconclusive: 3 };

const USAGE = "usage: npm run --silent verify -- <spec.json | -> [--json]";

function readInput(source: string): { bytes: Uint8Array } | { error: string } {
  try {
    return { bytes: source === "-" ? readFileSync(0) : readFileSync(source) };
  } catch (e) {
    const code = e instanceof Error && "code" in e ? String((e as NodeJS.ErrnoException).code) : "";
    const why = code === "ENOENT" ? "there is no such file" : code === "EISDIR" ? "it is a directory" : e instanceof Error ? e.message : String(e);
    return { error: `The spec ${source === "-" ? "on standard input" : `file ${source}`} could not be read: ${why}.` };
  }
}

function reportFor(bytes: Uint8Array): Report {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return refusedInputReport(bytes, "The file is not UTF-8 text, so it cannot be a JSON spec.");
  }
  return verifySpecText(text);
}

function titleOf(bytes: Uint8Array): string | undefined {
  try {
    const v: unknown = JSON.parse(new TextDecoder().decode(bytes));
    if (v !== null && typeof v === "object" && "title" in v && typeof v.title === "string") return v.title;
  } catch {
    // The report already says why the text is not JSON.
  }
  return undefined;
}

function formatState(s: unknown): string {
  if (Array.isArray(s) && s.every((v) => typeof v === "number")) return `(${s.map((v) => Number(v.toPrecision(6))).join(", ")})`;
  if (Array.isArray(s)) return s.map(formatState).join(" | ");
  return String(s);
}

/** The readable summary (our own layout). */
function summary(report: Report, title?: string): string {
  const lines: string[] = [];
  lines.push(`Restpoint verification${title === undefined ? "" : `: ${title}`}`);
  const counts = { confirmed: 0, contradicted: 0, inconclusive: 0 };
  for (const c of report.claims) counts[c.status]++;
  const tally = report.verdict === "invalid" ? `${report.errors.length} error${report.errors.length === 1 ? "" : "s"} in the spec` : `${report.claims.length} claim${report.claims.length === 1 ? "" : "s"}: ${counts.confirmed} confirmed, ${counts.contradicted} contradicted, ${counts.inconclusive} inconclusive`;
  lines.push(`Verdict: ${report.verdict.toUpperCase()} (${tally})`);
  lines.push(`Spec SHA-256 ${report.specSha256}, engine ${report.engine.version}`);
  if (report.errors.length > 0) {
    lines.push("", "Errors");
    for (const e of report.errors) lines.push(`  ${e.path === "" ? "(whole spec)" : e.path}${e.line === undefined ? "" : ` (line ${e.line})`}: ${e.message}`);
  }
  if (report.claims.length > 0) {
    lines.push("", "Claims");
    const width = Math.max(...report.claims.map((c) => c.status.length));
    for (const c of report.claims) lines.push(`  ${c.status.padEnd(width)}  ${c.id} (${c.kind}): ${c.message}`);
  }
  if (report.restPoints !== undefined) {
    lines.push("", `Rest points of the replicator dynamics (${report.restPoints.length})`);
    for (const p of report.restPoints.slice(0, 50)) {
      lines.push(`  ${formatState(p.state)}  on ${p.support.join(", ")}: ${p.stability}, ${p.nash ? "Nash" : "not Nash"}${p.ess === null ? "" : p.ess ? ", ESS" : ", not ESS"}`);
    }
    if (report.restPoints.length > 50) lines.push(`  ... and ${report.restPoints.length - 50} more (see --json)`);
  }
  if (report.experiments.length > 0) {
    lines.push("", "Experiments");
    for (const e of report.experiments) {
      const tEnd = e.times[e.times.length - 1];
      const end = e.states[e.states.length - 1];
      lines.push(`  ${e.id}: ${e.times.length} samples${tEnd === undefined ? "" : ` to t = ${tEnd}`}${end === undefined ? "" : `, ending at ${formatState(end)}`}${e.error === undefined ? "" : `; stopped: ${e.error}`}`);
    }
  }
  if (report.notes !== undefined && report.notes.length > 0) {
    lines.push("", "How this was checked");
    for (const n of report.notes) lines.push(`  - ${n}`);
  }
  return `${lines.join("\n")}\n`;
}

function main(argv: string[]): number {
  const json = argv.includes("--json");
  const rest = argv.filter((a) => a !== "--json");
  const source = rest[0];
  if (rest.length !== 1 || source === undefined || (source.startsWith("--") && source !== "-")) {
    process.stderr.write(`${USAGE}\n`);
    return 2;
  }
  const input = readInput(source);
  let report: Report;
  let title: string | undefined;
  if ("error" in input) {
    process.stderr.write(`${input.error}\n`);
    report = refusedInputReport(new Uint8Array(0), input.error);
  } else {
    report = reportFor(input.bytes);
    title = titleOf(input.bytes);
  }
  process.stdout.write(json ? `${JSON.stringify(report)}\n` : summary(report, title));
  return EXIT_STATUS[report.verdict];
}

process.exitCode = main(process.argv.slice(2));
