import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const example = "schemas/examples/fog-dune-beetles.json";
const dir = mkdtempSync(path.join(tmpdir(), "restpoint-cli-"));

function cli(args: string[], input?: string): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync("npx", ["tsx", "scripts/verify.ts", ...args], { input, encoding: "utf8", timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function file(name: string, content: string): string {
  const p = path.join(dir, name);
  writeFileSync(p, content);
  return p;
}

const game = { kind: "symmetric", strategies: ["a", "b"], payoffs: [[0, 2], [1, 1]] };
const specWith = (claims: unknown[]): string => JSON.stringify({ format: "restpoint/model@1", title: "CLI check", game, claims });

describe("verify command line", () => {
  it("--json prints exactly one report on stdout and exits 0 when confirmed", () => {
    const r = cli([example, "--json"]);
    expect(r.status).toBe(0);
    expect(r.stdout.endsWith("\n")).toBe(true);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    const report = JSON.parse(r.stdout) as { format: string; verdict: string };
    expect(report.format).toBe("restpoint/report@1");
    expect(report.verdict).toBe("confirmed");
  });

  it("gives byte-identical reports in separate processes", () => {
    expect(cli([example, "--json"]).stdout).toBe(cli(["--json", example]).stdout);
  });

  it("prints a readable summary without --json", () => {
    const r = cli([example]);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^Restpoint verification: Fog basking on an imagined coastal dune/);
    expect(r.stdout).toMatch(/Verdict: CONFIRMED \(10 claims: 10 confirmed, 0 contradicted, 0 inconclusive\)/);
    expect(r.stdout).toMatch(/Rest points of the replicator dynamics \(7\)/);
    expect(r.stdout).toMatch(/it is not a peer review/);
  });

  it("reads the spec from standard input with -, and exits 1 when a claim is contradicted", () => {
    // rest points of this game: both vertices and (1/2, 1/2); claiming 2 is wrong
    const r = cli(["-", "--json"], specWith([{ id: "count", kind: "rest-point-count", count: 2 }]));
    expect(r.status).toBe(1);
    expect((JSON.parse(r.stdout) as { verdict: string }).verdict).toBe("contradicted");
  });

  it("exits 3 when a claim is inconclusive", () => {
    const zero = JSON.stringify({ format: "restpoint/model@1", title: "Neutral", game: { ...game, payoffs: [[0, 0], [0, 0]] }, claims: [{ id: "count", kind: "rest-point-count", count: 3 }] });
    const r = cli([file("neutral.json", zero)]);
    expect(r.status).toBe(3);
    expect(r.stdout).toMatch(/Verdict: INCONCLUSIVE/);
  });

  it("exits 2 for a file that is not JSON, with a clear message in the report", () => {
    const r = cli([file("notes.json", "title: not json\n"), "--json"]);
    expect(r.status).toBe(2);
    const report = JSON.parse(r.stdout) as { verdict: string; errors: { message: string }[] };
    expect(report.verdict).toBe("invalid");
    expect(report.errors[0]?.message).toBe('The file is not valid JSON at line 1, column 1, near "title: not j".');
    const plain = cli([file("notes2.json", "title: not json\n")]);
    expect(plain.status).toBe(2);
    expect(plain.stdout).toMatch(/Errors\n {2}\(whole spec\) \(line 1\): The file is not valid JSON/);
  });

  it("exits 2 for an invalid spec", () => {
    const r = cli([file("bad.json", JSON.stringify({ format: "restpoint/model@1", title: "x", game, claims: [] }))]);
    expect(r.status).toBe(2);
    expect(r.stdout).toMatch(/\/claims: The spec must make at least one claim\./);
  });

  it("exits 2 for bytes that are not UTF-8", () => {
    const p = path.join(dir, "latin1.json");
    writeFileSync(p, Buffer.from([0x7b, 0xe9, 0x7d]));
    const r = cli([p, "--json"]);
    expect(r.status).toBe(2);
    expect(r.stdout).toMatch(/The file is not UTF-8 text, so it cannot be a JSON spec\./);
  });

  it("exits 2 for a missing file, saying so on stderr and in the report", () => {
    const r = cli([path.join(dir, "absent.json"), "--json"]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/could not be read: there is no such file\./);
    const report = JSON.parse(r.stdout) as { verdict: string; errors: { message: string }[] };
    expect(report.verdict).toBe("invalid");
    expect(report.errors[0]?.message).toMatch(/^The spec file .*absent\.json could not be read: there is no such file\.$/);
  });

  it("exits 2 for a directory", () => {
    const r = cli([dir]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/could not be read: it is a directory\./);
  });

  it("prints usage on stderr only, and exits 2, without a spec argument", () => {
    const r = cli(["--json"]);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr).toBe("usage: npm run --silent verify -- <spec.json | -> [--json]\n");
  });
});
