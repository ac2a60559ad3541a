/**
 * Earth-centred, Earth-fixed (ECEF) coordinates for the OIFITS array table (FRAME = 'GEOCENTRIC').
 *
 * Ellipsoid WGS 84 (NIMA TR8350.2, 3rd ed., 2000, Table 3.1): a = 6378137 m, 1/f = 298.257223563.
 * Geodetic latitude φ, east longitude λ, height h:
 *   X = (N + h) cos φ cos λ,  Y = (N + h) cos φ sin λ,  Z = (N (1 − e²) + h) sin φ,
 *   N = a / √(1 − e² sin² φ),  e² = f (2 − f).
 * A local east/north/up offset (E, N, U) at (φ, λ) rotates into ECEF offsets
 *   dX = −sin λ·E − sin φ cos λ·N + cos φ cos λ·U
 *   dY =  cos λ·E − sin φ sin λ·N + cos φ sin λ·U
 *   dZ =             cos φ·N      + sin φ·U
 * (the columns are the local east, north and up unit vectors; lengths are preserved).
 */

export const WGS84_A_M = 6378137;
export const WGS84_INV_F = 298.257223563;

/** ECEF position, metres, of a geodetic latitude and east longitude (radians) and ellipsoidal height (m). */
export function geodeticToEcef(latRad: number, lonEastRad: number, heightM: number): [number, number, number] {
  const f = 1 / WGS84_INV_F;
  const e2 = f * (2 - f);
  const s = Math.sin(latRad);
  const n = WGS84_A_M / Math.sqrt(1 - e2 * s * s);
  const c = Math.cos(latRad);
  return [
    (n + heightM) * c * Math.cos(lonEastRad),
    (n + heightM) * c * Math.sin(lonEastRad),
    (n * (1 - e2) + heightM) * s,
  ];
}

/** ECEF offset, metres, of a local east/north/up offset at a site (latitude, east longitude in radians). */
export function enuToEcefOffset(
  eastM: number,
  northM: number,
  upM: number,
  latRad: number,
  lonEastRad: number,
): [number, number, number] {
  const sp = Math.sin(latRad);
  const cp = Math.cos(latRad);
  const sl = Math.sin(lonEastRad);
  const cl = Math.cos(lonEastRad);
  return [
    -sl * eastM - sp * cl * northM + cp * cl * upM,
    cl * eastM - sp * sl * northM + cp * sl * upM,
    cp * northM + sp * upM,
  ];
}
