/** Reconstruction requests made from simulated observations, for the imaging engine's tests. */
import {
  parseReconstructRequest,
  parseSimulateRequest,
  simulateData,
  simulateResponse,
  type TargetModel,
} from "~/engine";
import { demoSite } from "./demo-array";

/**
 * The reconstruction request for `model` (at RA 201.37°, Dec −30.2°, seen from the demo site) observed as
 * `observing` says (stations, wavelengths, hour angles, triangles, noise), with the `image` settings.
 * Throws when the engine refuses either request, so a test never runs on a request it did not mean.
 */
export function reconstructionRequest(
  model: TargetModel,
  observing: Record<string, unknown>,
  image: Record<string, unknown> = {},
) {
  const sim = parseSimulateRequest({ site: demoSite(), target: { raDeg: 201.37, decDeg: -30.2, model }, ...observing });
  if (!sim.ok) throw new Error(sim.message);
  const parsed = parseReconstructRequest({ data: simulateResponse(simulateData(sim.value)), image, model });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value;
}
