/** Target models in words, for tables and summaries (pure, safe in the browser). */
import type { TargetModelJson } from "~/db/schema/proposals";

/**
 * A model in a few words: "uniform disk 3 mas", "binary 4 mas at 60°, ratio 0.4". Takes a stored
 * model; every `TargetModel` of the engine is one.
 */
export function describeModel(model: TargetModelJson): string {
  const n = (k: string) => (typeof model[k] === "number" ? (model[k] as number) : NaN);
  switch (model.type) {
    case "point":
      return "point";
    case "uniformDisk":
      return `uniform disk ${n("diameterMas")} mas`;
    case "gaussian":
      return `Gaussian ${n("fwhmMas")} mas FWHM`;
    case "limbDarkenedDisk":
      return `limb-darkened disk ${n("diameterMas")} mas (a = ${n("coefficient")})`;
    case "ring":
      return `ring ${n("diameterMas")} mas`;
    case "binary":
      return `binary ${n("separationMas")} mas at ${n("positionAngleDeg")}°, ratio ${n("fluxRatio")}`;
    case "sum":
      return `composite (${Array.isArray(model.components) ? model.components.length : "?"} parts)`;
    default:
      return model.type;
  }
}
