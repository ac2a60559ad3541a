/** A closure triangle chosen for a target, in words: "A1–B3–C2", and what it was ranked for. */
import type { ClosureTriangleJson } from "~/db/schema/proposals";

/** "A1–B3–C2", as pages show a triangle. */
export const triangleText = (t: Pick<ClosureTriangleJson, "stations">) => t.stations.join("–");

/** "ranked for Duo J on configuration pair at Valle" (or "on every station"). */
export function rankedForText(t: ClosureTriangleJson): string {
  const pool = t.configuration === null ? "every station" : `configuration ${t.configuration}`;
  return `ranked for ${t.instrument} ${t.band} on ${pool} at ${t.site}`;
}

/** "Closure triangle A1–B3–C2 (ranked for …)", as frozen versions list it; null when none was chosen. */
export function closureTriangleLine(t: ClosureTriangleJson | null | undefined): string | null {
  return t ? `Closure triangle ${triangleText(t)} (${rankedForText(t)})` : null;
}
