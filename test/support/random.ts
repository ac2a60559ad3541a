import fc from "fast-check";
/** A small deterministic pseudo-random generator (mulberry32) for reproducible cases: numbers in [0, 1). */
export function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * fast-check generators of a sky position for property tests: right ascension 0–359.9°, declination
 * −89° … +60° (what a southern site can reach), degrees, never NaN.
 */
export function skyPositionArbitraries() {
  return {
    raDeg: fc.double({ min: 0, max: 359.9, noNaN: true }),
    decDeg: fc.double({ min: -89, max: 60, noNaN: true }),
  };
}
