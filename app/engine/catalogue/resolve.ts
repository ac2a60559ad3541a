/**
 * `cli resolve`: a typed star name → the star's position, photometry and designations.
 */
import { RAD_TO_DEG, roundTo } from "../math";
import { designationsOf, displayName, type StarCatalogue } from "./build";
import { lookupStar } from "./lookup";
import type { ResolveResponse } from "./types";

/** "A", "A or B", "A, B or C". */
export function orList(items: readonly string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} or ${items[items.length - 1]}`;
}

/** The one-line reason for a name no star carries: `no star called "…" (did you mean …?)`. */
export function unknownNameMessage(name: string, suggestions: readonly string[]): string {
  const hint = suggestions.length > 0 ? ` (did you mean ${orList(suggestions)}?)` : "";
  return `no star called "${name.trim()}"${hint}`;
}

/** The response fields of a catalogue row. */
export function describeStar(catalogue: StarCatalogue, row: number): Omit<ResolveResponse, "matchedBy" | "alsoNamed"> {
  const hd = catalogue.names.get(row)?.hd;
  const bv = catalogue.bv[row];
  return {
    name: displayName(catalogue, row),
    hip: catalogue.hip[row],
    hd: hd ? Number(hd.slice(3)) : null,
    raDeg: roundTo(catalogue.raRad[row] * RAD_TO_DEG, 6),
    decDeg: roundTo(catalogue.decRad[row] * RAD_TO_DEG, 6),
    vMag: catalogue.vMag[row],
    bv: Number.isNaN(bv) ? null : bv,
    designations: designationsOf(catalogue, row),
  };
}

/**
 * Resolves a name. On failure the message is the contract's reason without the field prefix:
 * `no star called "Betelgeuze Prime" (did you mean Betelgeuse?)`.
 */
export function resolveStar(
  catalogue: StarCatalogue,
  name: string,
): { ok: true; value: ResolveResponse } | { ok: false; message: string } {
  const hit = lookupStar(catalogue, name);
  if (!hit.found) return { ok: false, message: unknownNameMessage(name, hit.suggestions) };
  return {
    ok: true,
    value: {
      ...describeStar(catalogue, hit.row),
      matchedBy: hit.matchedBy,
      alsoNamed: hit.alsoNamed.map((r) => {
        const proper = catalogue.names.get(r)?.proper ?? [];
        return designationsOf(catalogue, r).find((d) => !proper.includes(d)) ?? displayName(catalogue, r);
      }),
    },
  };
}
