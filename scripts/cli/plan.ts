/**
 * `npm run -s cli -- plan --input FILE`: one night's plan of calibrator–science–calibrator
 * sequences (docs/cli-plan.md).
 */
import { CliRequestError } from "./errors";

/** Validates the request and plans the night; a bad request throws CliRequestError("<field>: <reason>"). */
export async function runPlan(json: unknown): Promise<unknown> {
  const { computePlan, parsePlanRequest } = await import("../../app/engine");
  const parsed = parsePlanRequest(json);
  if (!parsed.ok) throw new CliRequestError(parsed.message);
  return computePlan(parsed.value);
}
