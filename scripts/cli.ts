/**
 * Fringe Docket command line: `npm run -s cli -- <command> [--input FILE] [--pretty]`.
 *
 * Commands: coverage, ephemeris, triangles. The request is a JSON object read
 * from FILE, or from standard input when --input is absent. On success exactly
 * one JSON object is written to standard output (exit 0). On a bad request —
 * unknown command or option, missing or unreadable file, invalid JSON, a
 * validation failure, a request over the cost budget — nothing is written to
 * standard output, one line
 * `error: <reason>` goes to standard error and the exit status is 2 (1 for an
 * unexpected internal failure). See docs/cli.md.
 *
 * The engine is loaded only once the arguments are read (astronomia through
 * its subpaths), to keep start-up short.
 */
import { readFile } from "node:fs/promises";
import type { BudgetFailure, ParseResult } from "~/engine";

const USAGE = `usage: npm run -s cli -- <coverage|ephemeris|triangles> [--input FILE] [--pretty]
  Reads a JSON request from FILE (or standard input) and prints one JSON object.
  See docs/cli.md for the request and response fields.`;

class UsageError extends Error {}

interface Options {
  command: string;
  input: string | null;
  pretty: boolean;
}

function parseArgs(argv: string[]): Options | "help" {
  if (argv.length === 0) throw new UsageError("no command given (coverage, ephemeris or triangles; --help for usage)");
  let command: string | null = null;
  let input: string | null = null;
  let pretty = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "-h" || a === "--help" || a === "help") return "help";
    if (a === "--pretty") pretty = true;
    else if (a === "--input" || a === "-i") {
      const next = argv[i + 1];
      if (next === undefined || next.startsWith("--")) throw new UsageError("--input needs a file name");
      input = next;
      i++;
    } else if (a.startsWith("--input=")) input = a.slice("--input=".length);
    else if (a.startsWith("-")) throw new UsageError(`unknown option ${a}`);
    else if (command === null) command = a;
    else throw new UsageError(`unexpected argument ${a}`);
  }
  if (command === null) throw new UsageError("no command given (coverage, ephemeris or triangles)");
  return { command, input, pretty };
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

/**
 * A command: the engine's parser of its request, its cost budget, then the computation, in this
 * process (a refusal or a request over budget is a usage error).
 */
function command<T, R>(
  parse: (json: unknown) => ParseResult<T>,
  budget: (value: T) => BudgetFailure | null,
  compute: (value: T) => R,
) {
  return (json: unknown): R => {
    const parsed = parse(json);
    if (!parsed.ok) throw new UsageError(parsed.message);
    const over = budget(parsed.value);
    if (over) throw new UsageError(over.message);
    return compute(parsed.value);
  };
}

async function run(opts: Options): Promise<unknown> {
  const engine = await import("~/engine");
  const commands: Record<string, (json: unknown) => unknown> = {
    coverage: command(engine.parseCoverageRequest, engine.coverageBudgetFailure, engine.computeCoverage),
    triangles: command(engine.parseTrianglesRequest, engine.trianglesBudgetFailure, engine.rankTriangles),
    ephemeris: command(engine.parseEphemerisRequest, () => null, engine.computeEphemeris),
  };
  if (!Object.hasOwn(commands, opts.command)) {
    throw new UsageError(`unknown command "${opts.command}" (expected coverage, ephemeris or triangles)`);
  }
  return commands[opts.command](await readRequest(opts.input));
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
