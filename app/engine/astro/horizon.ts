/**
 * Horizontal coordinates from hour angle and declination (Meeus 13.5, 13.6).
 */
import { clampedAsin } from "../math";

/**
 * Geometric elevation (altitude), radians in [−π/2, π/2]:
 * sin e = sin φ sin δ + cos φ cos δ cos H. No refraction.
 * @param latRad site latitude φ, radians
 * @param decRad declination δ, radians
 * @param haRad hour angle H, radians (any value; periodic)
 */
export function elevationRad(latRad: number, decRad: number, haRad: number): number {
  return clampedAsin(Math.sin(latRad) * Math.sin(decRad) + Math.cos(latRad) * Math.cos(decRad) * Math.cos(haRad));
}

/**
 * Azimuth, radians in [0, 2π), measured from north through east.
 * Undefined (returns 0) exactly at the zenith.
 */
export function azimuthRad(latRad: number, decRad: number, haRad: number): number {
  const y = -Math.cos(decRad) * Math.sin(haRad);
  const x = Math.sin(decRad) * Math.cos(latRad) - Math.cos(decRad) * Math.cos(haRad) * Math.sin(latRad);
  const a = Math.atan2(y, x);
  return a < 0 ? a + 2 * Math.PI : a;
}
