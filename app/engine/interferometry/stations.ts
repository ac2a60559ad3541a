/**
 * Station positions: local east/north/up (ENU) metres → equatorial XYZ metres.
 *
 * Equatorial frame (Thompson, Moran & Swenson 2017, §4.1): X toward
 * (H = 0, δ = 0), Y toward (H = −6 h, δ = 0), Z toward the celestial pole.
 * At geodetic latitude φ: X = −sin φ·N + cos φ·U, Y = E, Z = cos φ·N + sin φ·U.
 */

export interface EnuStation {
  /** Metres toward local east. */
  eastM: number;
  /** Metres toward local north. */
  northM: number;
  /** Metres toward local zenith. */
  upM: number;
}

export interface EquatorialVector {
  xM: number;
  yM: number;
  zM: number;
}

/** Converts one ENU vector (metres) at latitude latRad to equatorial XYZ (metres). */
export function enuToEquatorial(eastM: number, northM: number, upM: number, latRad: number): EquatorialVector {
  const s = Math.sin(latRad);
  const c = Math.cos(latRad);
  return { xM: -s * northM + c * upM, yM: eastM, zM: c * northM + s * upM };
}

/**
 * Equatorial XYZ of every station, packed [x0, y0, z0, x1, y1, z1, ...] in
 * metres, in the order given.
 */
export function stationsToEquatorial(stations: readonly EnuStation[], latRad: number): Float64Array {
  const out = new Float64Array(stations.length * 3);
  for (let i = 0; i < stations.length; i++) {
    const p = enuToEquatorial(stations[i].eastM, stations[i].northM, stations[i].upM, latRad);
    out[3 * i] = p.xM;
    out[3 * i + 1] = p.yM;
    out[3 * i + 2] = p.zM;
  }
  return out;
}
