/**
 * Which station names a site plan can draw without them running into each other: a name is drawn
 * when the nearest other station is far enough away on screen, and is left to the hover otherwise
 * (the core of an array packs a dozen stations into a few tens of metres). Pure; shared by the
 * registry's site plan and the Sketchpad's station picker.
 */

type Placed = { eastM: number; northM: number };

/** A station's name is drawn when the nearest other station is at least this far away on screen, pixels. */
export const LABEL_SPACING_PX = 24;

/** For each station, the ground distance to its nearest neighbour, metres (Infinity when alone). */
export function nearestDistances(stations: readonly Placed[]): number[] {
  return stations.map((s, i) => {
    let best = Infinity;
    stations.forEach((o, j) => {
      if (i !== j) best = Math.min(best, Math.hypot(s.eastM - o.eastM, s.northM - o.northM));
    });
    return best;
  });
}

/** The larger of the east–west and north–south spans, metres; at least 20 (100 for no stations). */
export function extent(stations: readonly Placed[]): number {
  if (stations.length === 0) return 100;
  const es = stations.map((s) => s.eastM);
  const ns = stations.map((s) => s.northM);
  return Math.max(Math.max(...es) - Math.min(...es), Math.max(...ns) - Math.min(...ns), 20);
}

/** For each station, whether its name has room on a plan drawn at `metresPerPixel`. */
export function namesWithRoom(stations: readonly Placed[], metresPerPixel: number): boolean[] {
  return nearestDistances(stations).map((d) => d / metresPerPixel >= LABEL_SPACING_PX);
}
