/**
 * Angular distance between two directions on the sphere.
 */

/**
 * Great-circle distance, radians in [0, π], by the atan2 form of the spherical law (Vincenty 1975,
 * special case of the sphere): accurate at every distance, unlike the plain arccosine near 0 and π.
 * @param ra1Rad, dec1Rad first direction, radians
 * @param ra2Rad, dec2Rad second direction, radians (same equator and equinox)
 */
export function angularSeparationRad(ra1Rad: number, dec1Rad: number, ra2Rad: number, dec2Rad: number): number {
  const dRa = ra2Rad - ra1Rad;
  const s1 = Math.sin(dec1Rad);
  const c1 = Math.cos(dec1Rad);
  const s2 = Math.sin(dec2Rad);
  const c2 = Math.cos(dec2Rad);
  const cd = Math.cos(dRa);
  const x = c2 * Math.sin(dRa);
  const y = c1 * s2 - s1 * c2 * cd;
  return Math.atan2(Math.hypot(x, y), s1 * s2 + c1 * c2 * cd);
}
