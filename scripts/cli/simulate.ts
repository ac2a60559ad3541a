/**
 * `cli simulate`: the data a coverage would yield (see docs/cli-simulate.md). With `oifitsPath` the data
 * are also written as an OIFITS 2 file there.
 */
import { writeFile } from "node:fs/promises";
import { oifitsBytes, parseSimulateRequest, simulateData, simulateResponse } from "../../app/engine";
import { CliRequestError } from "./errors";

export async function runSimulate(json: unknown, options: { oifitsPath?: string | null } = {}): Promise<unknown> {
  const parsed = parseSimulateRequest(json);
  if (!parsed.ok) throw new CliRequestError(parsed.message);
  const data = simulateData(parsed.value);
  if (options.oifitsPath) {
    const written = new Date().toISOString().slice(0, 19);
    try {
      await writeFile(options.oifitsPath, oifitsBytes(data, parsed.value, written));
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code ?? "error";
      throw new CliRequestError(`--oifits: cannot write ${options.oifitsPath} (${code})`);
    }
  }
  return simulateResponse(data);
}
