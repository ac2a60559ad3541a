/**
 * Running the command line from a test: `npx tsx scripts/cli.ts …` in the project folder, with request
 * files written to a temporary folder of the test file's own.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { expect } from "vitest";

const ROOT = fileURLToPath(new URL("../..", import.meta.url));

/** Runs `npm run -s cli -- <args>` (through tsx) with `stdin` on standard input. */
export function cli(args: string[], stdin = "") {
  const r = spawnSync("npx", ["tsx", "scripts/cli.ts", ...args], {
    cwd: ROOT,
    input: stdin,
    encoding: "utf8",
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** A temporary folder and a writer of request files in it (JSON, or text as given). */
export function requestFiles(prefix: string) {
  const dir = mkdtempSync(join(tmpdir(), `fd-${prefix}-`));
  return {
    dir,
    file(name: string, content: unknown): string {
      const p = join(dir, name);
      writeFileSync(p, typeof content === "string" ? content : JSON.stringify(content));
      return p;
    },
  };
}

/** Runs the command and checks that it succeeded quietly (exit 0, nothing on standard error). */
export function cliOk(args: string[], stdin = "") {
  const r = cli(args, stdin);
  expect(r.status, r.stderr).toBe(0);
  expect(r.stderr).toBe("");
  return r;
}

/** Runs the command on a request it must refuse: exit 2, nothing on standard output, one line on standard error. */
export function expectRefused(args: string[], message: RegExp, stdin = "") {
  const r = cli(args, stdin);
  expect(r.status).toBe(2);
  expect(r.stdout).toBe("");
  const lines = r.stderr.trimEnd().split("\n");
  expect(lines).toHaveLength(1);
  expect(lines[0]).toMatch(message);
}
