/** Targets given by name alone: the position of the star the name names, from the star catalogue. */
import { resolveName } from "~/services/catalogue/lookup.server";
import type { StarPositionResolver } from "./cells";

/** The J2000 position of the catalogue star `name` names (the form and the CSV import use it). */
export const starPosition: StarPositionResolver = (name) => {
  const found = resolveName(name);
  if (!found.ok) return { ok: false, message: found.message };
  const { star } = found;
  const label = star.name === `HIP ${star.hip}` ? star.name : `${star.name} (HIP ${star.hip})`;
  return { ok: true, raDeg: star.raDeg, decDeg: star.decDeg, star: label };
};
