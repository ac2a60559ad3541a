/**
 * When a target is observable on a configuration, in LST, weighed by the darkness of an observing
 * period: the second step of the LST pressure (lst-pressure.ts describes the whole method).
 *
 * The hour angle H = LST − α depends on LST only, so the engine's observability rules (elevation limit;
 * every baseline within the delay-line stroke, from interferometry/observability.ts) give the same
 * window on every night. They are evaluated at the edges of fine LST cells; a cell whose two edges
 * agree takes their verdict for all its darkness, a cell holding an edge of the window is evaluated on
 * {@link EDGE_SUBSAMPLES} slices, each weighted by its own darkness (an edge placed to ~1/32 of a cell).
 */
import { float64Arrays } from "../arrays";
import { elevationRad } from "../astro/horizon";
import type { BaselineSet } from "../interferometry/baselines";
import { observabilityMasks } from "../interferometry/observability";
import { computeUvwTracks } from "../interferometry/uv-tracks";
import { HOUR_TO_RAD } from "../math";
import type { PressureConfiguration } from "./inputs";

/** Slices of a fine cell that holds an edge of the observable window. */
export const EDGE_SUBSAMPLES = 16;

/** A configuration with its baselines built once. */
export interface PreparedConfiguration {
  config: PressureConfiguration;
  stationNames: string[];
  baselines: BaselineSet;
}

/**
 * Observable and sky-ok masks of a target on a configuration at hour angles haRad (radians). The
 * elevation is computed everywhere; the projected baselines only where the target is above its limit
 * (elsewhere the sample fails on elevation whatever the delay lines), then the engine's rules decide.
 */
function masksAt(prep: PreparedConfiguration, haRad: Float64Array, decRad: number, latRad: number, minElRad: number) {
  const n = haRad.length;
  const observable = new Uint8Array(n);
  const skyOk = new Uint8Array(n);
  const upIndex = new Int32Array(n);
  const [upHa, upEl] = float64Arrays(2, n);
  let nUp = 0;
  for (let i = 0; i < n; i++) {
    const el = elevationRad(latRad, decRad, haRad[i]);
    if (el >= minElRad) {
      upIndex[nUp] = i;
      upHa[nUp] = haRad[i];
      upEl[nUp] = el;
      nUp++;
    }
  }
  if (nUp === 0) return { observable, skyOk };
  const ha = upHa.subarray(0, nUp);
  const m = observabilityMasks({
    elevationRad: upEl.subarray(0, nUp),
    minElevationRad: minElRad,
    sunAltitudeRad: null,
    tracks: computeUvwTracks(prep.baselines, ha, decRad),
    baselines: prep.baselines,
    stationNames: prep.stationNames,
    delayLineStrokeM: prep.config.delayLineStrokeM,
  });
  for (let k = 0; k < nUp; k++) {
    observable[upIndex[k]] = m.observable[k];
    skyOk[upIndex[k]] = m.skyOk[k];
  }
  return { observable, skyOk };
}

/**
 * Dark hours over the period in which the target is observable, per fine LST cell, and in which it is
 * above its elevation limit (total). The rules are evaluated at the cell edges; a cell whose two edges
 * agree takes their value for its whole darkness; a cell whose edges differ (a rising, setting or
 * delay-line edge inside it) is evaluated at the centre of each of its {@link EDGE_SUBSAMPLES} slices,
 * each slice weighted by its own darkness. A window shorter than one cell with both edges outside it is
 * missed.
 */
export function observableDarkHours(
  prep: PreparedConfiguration,
  raH: number,
  decRad: number,
  latRad: number,
  minElRad: number,
  darkness: { perCell: Float64Array; perSlice: Float64Array },
): { observablePerCell: Float64Array; skyH: number } {
  const nCells = darkness.perCell.length;
  const k = EDGE_SUBSAMPLES;
  const cellH = 24 / nCells;
  const edgeHa = new Float64Array(nCells);
  for (let c = 0; c < nCells; c++) edgeHa[c] = (c * cellH - raH) * HOUR_TO_RAD;
  const edges = masksAt(prep, edgeHa, decRad, latRad, minElRad);
  const observablePerCell = new Float64Array(nCells);
  let skyH = 0;
  const mixed: number[] = [];
  for (let c = 0; c < nCells; c++) {
    const next = (c + 1) % nCells;
    if (edges.observable[c] === edges.observable[next] && edges.skyOk[c] === edges.skyOk[next]) {
      if (edges.observable[c]) observablePerCell[c] = darkness.perCell[c];
      if (edges.skyOk[c]) skyH += darkness.perCell[c];
    } else if (darkness.perCell[c] > 0) mixed.push(c);
  }
  if (mixed.length > 0) {
    const ha = new Float64Array(mixed.length * k);
    mixed.forEach((c, i) => {
      for (let j = 0; j < k; j++) ha[i * k + j] = ((c + (j + 0.5) / k) * cellH - raH) * HOUR_TO_RAD;
    });
    const slices = masksAt(prep, ha, decRad, latRad, minElRad);
    mixed.forEach((c, i) => {
      for (let j = 0; j < k; j++) {
        const d = darkness.perSlice[c * k + j];
        if (slices.observable[i * k + j]) observablePerCell[c] += d;
        if (slices.skyOk[i * k + j]) skyH += d;
      }
    });
  }
  return { observablePerCell, skyH };
}
