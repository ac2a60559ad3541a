/** `cli reconstruct`: an image from V² and closure phases (see docs/cli-reconstruct.md). */
import { computeReconstruction, parseReconstructRequest } from "../../app/engine";
import { CliRequestError } from "./errors";

export async function runReconstruct(json: unknown): Promise<unknown> {
  const parsed = parseReconstructRequest(json);
  if (!parsed.ok) throw new CliRequestError(parsed.message);
  return computeReconstruction(parsed.value);
}
