/**
 * `npm run -s cli -- calibrators`: the calibrator shortlist of a target (see docs/cli-catalogue.md).
 */
import { parseCalibratorsRequest, shortlistCalibrators } from "~/engine";
import { loadCatalogue } from "./catalogue-data";
import { CliRequestError } from "./errors";

export async function runCalibrators(json: unknown): Promise<unknown> {
  const parsed = parseCalibratorsRequest(json);
  if (!parsed.ok) throw new CliRequestError(parsed.message);
  const result = shortlistCalibrators(loadCatalogue(), parsed.value);
  if (!result.ok) throw new CliRequestError(`${result.field}: ${result.message}`);
  return result.value;
}
