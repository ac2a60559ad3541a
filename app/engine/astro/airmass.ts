/**
 * Relative air mass.
 */
import { DEG_TO_RAD } from "../math";

/**
 * Air mass by Kasten & Young (1989): X = 1 / (sin h + 0.50572 (h + 6.07995°)^−1.6364),
 * h the elevation in degrees. About sec z at moderate elevations and ≈ 37.9 at
 * the horizon.
 * @param elevationDeg elevation, degrees
 * @returns air mass ≥ 1, or +Infinity for an elevation below 0° (below the
 *   horizon the formula has no meaning; callers serialize it as null).
 */
export function airmassKastenYoung(elevationDeg: number): number {
  if (!(elevationDeg >= 0)) return Number.POSITIVE_INFINITY;
  const h = Math.min(elevationDeg, 90);
  return 1 / (Math.sin(h * DEG_TO_RAD) + 0.50572 * (h + 6.07995) ** -1.6364);
}

/**
 * Plane-parallel air mass sec z = 1 / sin(elevation); +Infinity at or below 0°.
 * Good to 1 % above about 20° elevation.
 */
export function airmassSecZ(elevationDeg: number): number {
  if (!(elevationDeg > 0)) return Number.POSITIVE_INFINITY;
  return 1 / Math.sin(Math.min(elevationDeg, 90) * DEG_TO_RAD);
}
