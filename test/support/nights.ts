/**
 * The Night builder's settings most night tests plan with: 30° minimum elevation, 10° from the Moon,
 * 45° from the Sun, 40 min science and 15 min calibrator blocks (written out here, not taken from the
 * app's defaults, so a change of those defaults does not change what the tests state).
 */
export function nightSettings<T extends object>(more: T = {} as T) {
  return {
    minElevationDeg: 30,
    moonMinSeparationDeg: 10,
    sunMinSeparationDeg: 45,
    scienceBlockMin: 40,
    calibratorBlockMin: 15,
    ...more,
  };
}
