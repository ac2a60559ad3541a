/**
 * Fringe Docket command line: `npm run -s cli -- <command> [--input FILE] [--pretty]`.
 *
 * Commands: coverage, ephemeris, triangles, plan, rank, resolve, calibrators, simulate, reconstruct. The request is a JSON object read
 * from FILE, or from standard input when --input is absent. On success exactly
 * one JSON object is written to standard output (exit 0). On a bad request —
 * unknown command or option, missing or unreadable file, invalid JSON, a
 * validation failure — nothing is written to standard output, one line
 * `error: <reason>` goes to standard error and the exit status is 2 (1 for an
 * unexpected internal failure). See docs/cli.md.
 *
 * The engine is loaded only once the arguments are read (astronomia through
 * its subpaths), to keep start-up short.
 */
import { readFile, writeFile } from "node:fs/promises";
import type { ParseResult } from "~/engine";

/** Every command, in the order the usage lists them. */
const COMMANDS = [
  "coverage",
  "ephemeris",
  "triangles",
  "plan",
  "rank",
  "resolve",
  "calibrators",
  "simulate",
  "reconstruct",
] as const;
const commandList = `${COMMANDS.slice(0, -1).join(", ")} or ${COMMANDS[COMMANDS.length - 1]}`;

const USAGE = `usage: npm run -s cli -- <${COMMANDS.join("|")}> [--input FILE] [--pretty]
       npm run -s cli -- simulate [--input FILE] --oifits OUT.fits   (also writes the data as OIFITS 2)
  Reads a JSON request from FILE (or standard input) and prints one JSON object.
  See docs/cli.md for the request and response fields.`;

class UsageError extends Error {}

interface Options {
  command: string;
  input: string | null;
  pretty: boolean;
  /** simulate only: also write the data as an OIFITS 2 file here. */
  oifits: string | null;
}

function parseArgs(argv: string[]): Options | "help" {
  if (argv.length === 0) throw new UsageError(`no command given (${commandList}; --help for usage)`);
  let command: string | null = null;
  const files: Record<"input" | "oifits", string | null> = { input: null, oifits: null };
  let pretty = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "-h" || a === "--help" || a === "help") return "help";
    const option = /^--(input|oifits)(?:=(.*))?$/.exec(a === "-i" ? "--input" : a);
    if (a === "--pretty") pretty = true;
    else if (option) {
      const name = option[1] as "input" | "oifits";
      let value = option[2];
      if (value === undefined) {
        value = argv[i + 1];
        if (value === undefined || value.startsWith("--")) throw new UsageError(`--${name} needs a file name`);
        i++;
      }
      files[name] = value;
    } else if (a.startsWith("-")) throw new UsageError(`unknown option ${a}`);
    else if (command === null) command = a;
    else throw new UsageError(`unexpected argument ${a}`);
  }
  if (command === null) throw new UsageError(`no command given (${commandList})`);
  if (files.oifits !== null && command !== "simulate") throw new UsageError("--oifits applies to simulate only");
  return { command, input: files.input, pretty, oifits: files.oifits };
}

async function readStdin(): Promise<string> {
  if (process.stdin.isTTY) throw new UsageError("no input: pass --input FILE or pipe a JSON request on standard input");
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString("utf8");
}

async function readRequest(input: string | null): Promise<unknown> {
  let text: string;
  if (input === null) text = await readStdin();
  else {
    try {
      text = await readFile(input, "utf8");
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      throw new UsageError(
        code === "ENOENT" ? `input file not found: ${input}` : `cannot read input file ${input} (${code ?? "error"})`,
      );
    }
  }
  if (text.trim() === "") throw new UsageError("the request is empty: expected a JSON object");
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new UsageError(`the request is not valid JSON: ${(e as Error).message.split("\n")[0]}`);
  }
}

/** A command: the engine's parser of its request, then the computation (a refusal is a usage error). */
function command<T, R>(parse: (json: unknown) => ParseResult<T>, compute: (value: T) => R) {
  return (json: unknown): R => {
    const parsed = parse(json);
    if (!parsed.ok) throw new UsageError(parsed.message);
    return compute(parsed.value);
  };
}

/** A computation's own refusal (`{ok: false, message, field?}`) as a usage error naming the field. */
function settled<T>(
  result: { ok: true; value: T } | { ok: false; message: string; field?: string },
  field?: string,
): T {
  if (result.ok) return result.value;
  const name = result.field ?? field;
  throw new UsageError(name ? `${name}: ${result.message}` : result.message);
}

/** Writes the OIFITS file of `simulate`; a path that cannot be written is the request's fault. */
async function writeOifits(path: string, bytes: Uint8Array): Promise<void> {
  try {
    await writeFile(path, bytes);
  } catch (e) {
    throw new UsageError(`--oifits: cannot write ${path} (${(e as NodeJS.ErrnoException).code ?? "error"})`);
  }
}

async function run(opts: Options): Promise<unknown> {
  const engine = await import("~/engine");
  const { loadCatalogue: catalogue } = await import("~/services/catalogue/data.server");
  const commands: Record<(typeof COMMANDS)[number], (json: unknown) => unknown> = {
    coverage: command(engine.parseCoverageRequest, engine.computeCoverage),
    triangles: command(engine.parseTrianglesRequest, engine.rankTriangles),
    ephemeris: command(engine.parseEphemerisRequest, engine.computeEphemeris),
    plan: command(engine.parsePlanRequest, engine.computePlan),
    rank: command(engine.parseRankRequest, engine.rankReviews),
    resolve: command(engine.parseResolveRequest, (v) => settled(engine.resolveStar(catalogue(), v.name), "name")),
    calibrators: command(engine.parseCalibratorsRequest, (v) => settled(engine.shortlistCalibrators(catalogue(), v))),
    simulate: command(engine.parseSimulateRequest, async (v) => {
      const data = engine.simulateData(v);
      if (opts.oifits)
        await writeOifits(opts.oifits, engine.oifitsBytes(data, v, new Date().toISOString().slice(0, 19)));
      return engine.simulateResponse(data);
    }),
    reconstruct: command(engine.parseReconstructRequest, engine.computeReconstruction),
  };
  if (!(COMMANDS as readonly string[]).includes(opts.command)) {
    throw new UsageError(`unknown command "${opts.command}" (expected ${commandList})`);
  }
  return await commands[opts.command as (typeof COMMANDS)[number]](await readRequest(opts.input));
}

function fail(message: string, status: number): void {
  process.stderr.write(`error: ${message.replace(/\s*\n\s*/g, " ")}\n`);
  process.exitCode = status;
}

async function main(): Promise<void> {
  let opts: Options | "help";
  try {
    opts = parseArgs(process.argv.slice(2));
  } catch (e) {
    fail((e as Error).message, 2);
    return;
  }
  if (opts === "help") {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  let result: unknown;
  try {
    result = await run(opts);
  } catch (e) {
    if (e instanceof UsageError || e instanceof RangeError) fail(e.message, 2);
    else fail(`internal error: ${(e as Error)?.message ?? String(e)}`, 1);
    return;
  }
  const text = opts.pretty ? JSON.stringify(result, null, 2) : JSON.stringify(result);
  process.stdout.write(`${text}\n`);
}

void main();
