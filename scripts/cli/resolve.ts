/**
 * `npm run -s cli -- resolve`: `{"name": "HD 39801"}` → the star's position, V, B−V and designations.
 * An unknown name fails with `name: no star called "…" (did you mean …?)`.
 */
import { parseResolveRequest, resolveStar } from "~/engine";
import { loadCatalogue } from "./catalogue-data";
import { CliRequestError } from "./errors";

export async function runResolve(json: unknown): Promise<unknown> {
  const parsed = parseResolveRequest(json);
  if (!parsed.ok) throw new CliRequestError(parsed.message);
  const result = resolveStar(loadCatalogue(), parsed.value.name);
  if (!result.ok) throw new CliRequestError(`name: ${result.message}`);
  return result.value;
}
