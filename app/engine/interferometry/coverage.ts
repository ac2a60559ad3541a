/**
 * The coverage computation behind `cli coverage` and `POST /api/coverage`:
 * uv tracks, observability, model squared visibilities, closure phases, the
 * dirty beam and coverage figures, serialized to the response shape of the
 * project conventions. All heavy intermediate results stay in typed arrays
 * until this final step.
 *
 * Contract fields: samples[], baselines[].points[], closurePhases[].points[],
 * beam {fwhmMajorMas, fwhmMinorMas, positionAngleDeg, peakSidelobe}. Additions
 * are documented on the types below.
 */

import { float64Arrays } from "../arrays";
import { airmassKastenYoung } from "../astro/airmass";
import { starWindow } from "../astro/rise-set";
import { lmstHours } from "../astro/sidereal";
import { isoUtcFromJulianDay } from "../astro/time";
import type { CoverageInput } from "../inputs";
import { RAD_TO_DEG, RAD_TO_HOUR, RAD_TO_MAS, roundTo } from "../math";
import { closureCube, independentClosurePhaseCount, stationTriangles, type TriangleSet } from "./closure";
import { type CoverageFigures, coverageFigures } from "./coverage-quality";
import { dirtyBeam, dirtyImage, maxUvRadius } from "./dirty-beam";
import { HermitianImager } from "./fft2d";
import { type PreparedObservation, prepareObservation } from "./observation";
import { modelVisibilityCube, type VisibilityCube } from "./visibilities";

export interface CoverageSample {
  hourAngleH: number;
  elevationDeg: number;
  observable: boolean;
  /** Why the sample is not observable; null when it is. */
  reason: string | null;
  /** Addition: Kasten & Young air mass; null below the horizon. */
  airmass: number | null;
  /** Addition (night sampling only): instant, local mean sidereal time, Sun altitude. */
  utc?: string;
  lstH?: number;
  sunAltitudeDeg?: number;
}

export interface CoverageBaseline {
  stations: [string, string];
  /** Addition: ground length of the baseline, metres. */
  lengthM: number;
  /** One point per observable sample; vis2 has one entry per wavelength. */
  points: { hourAngleH: number; uM: number; vM: number; wM: number; vis2: number[] }[];
}

export interface CoverageClosure {
  stations: [string, string, string];
  /** One point per observable sample; closurePhaseDeg in (−180, 180], one per wavelength. */
  points: { hourAngleH: number; closurePhaseDeg: number[] }[];
}

export interface CoverageBeam {
  /** Contract: FWHM of the fitted central lobe, mas (null when undefined, e.g. one baseline). */
  fwhmMajorMas: number | null;
  fwhmMinorMas: number | null;
  /** Contract: position angle of the major axis, degrees east of north, [0, 180). */
  positionAngleDeg: number | null;
  /** Contract: largest positive beam value outside the main lobe (peak = 1). */
  peakSidelobe: number;
  /** Additions: the imaging set-up. */
  gridSize: number;
  weighting: "natural" | "uniform" | "robust";
  robust: number;
  pixelMas: number;
  fieldOfViewMas: number;
  uvPointCount: number;
  /**
   * Addition (beam.includeImages): the beam and the model's dirty image,
   * row-major gridSize² values, row index toward north, column index toward
   * east, phase centre at (gridSize/2, gridSize/2), rounded to 1e-6.
   */
  image?: number[];
  dirtyImage?: number[];
}

export interface CoverageNight {
  date: string;
  sunsetUtc: string | null;
  astronomicalDuskUtc: string | null;
  astronomicalDawnUtc: string | null;
  sunriseUtc: string | null;
  /** Target above the minimum elevation around local midnight (null when always/never above). */
  targetRiseUtc: string | null;
  targetTransitUtc: string;
  targetSetUtc: string | null;
  /** Target coordinates precessed to the night (mean equinox of date), degrees. */
  raOfDateDeg: number;
  decOfDateDeg: number;
}

export interface CoverageResponse {
  samples: CoverageSample[];
  baselines: CoverageBaseline[];
  closurePhases: CoverageClosure[];
  /** Null when the request sets beam: null or no observable uv point has a non-zero length. */
  beam: CoverageBeam | null;
  /** Additions. */
  wavelengthsM: number[];
  independentClosurePhases: number;
  figures: CoverageFigures & { observableHours: number };
  night: CoverageNight | null;
  notes: string[];
}

/** The typed-array results before serialization (used by the benchmark and tests). */
export interface CoverageArrays {
  observation: PreparedObservation;
  cube: VisibilityCube;
  vis2: Float64Array;
  triangles: TriangleSet;
  closurePhaseRad: Float64Array;
}

/** Computes uv tracks, model visibilities and closure phases in typed arrays. */
export function computeCoverageArrays(request: CoverageInput): CoverageArrays {
  const observation = prepareObservation(request);
  const cube = modelVisibilityCube(observation.model, observation.tracks, observation.wavelengthsM);
  const vis2 = new Float64Array(cube.re.length);
  for (let i = 0; i < vis2.length; i++) vis2[i] = cube.re[i] * cube.re[i] + cube.im[i] * cube.im[i];
  const triangles = stationTriangles(observation.stationNames.length);
  const closure = closureCube(cube, triangles, observation.observability.observable);
  return { observation, cube, vis2, triangles, closurePhaseRad: closure.phaseRad };
}

/**
 * Computes the coverage response for a validated request.
 * Beam: absent in the request ⇒ computed with the defaults (256², natural);
 * `beam: null` ⇒ not computed (response beam null).
 */
export function computeCoverage(request: CoverageInput): CoverageResponse {
  const arrays = computeCoverageArrays(request);
  const { observation: obs, cube, vis2, triangles, closurePhaseRad } = arrays;
  const { samples, tracks, observability, stationNames, baselines, wavelengthsM } = obs;
  const nS = tracks.nSamples;
  const nB = tracks.nBaselines;
  const nC = wavelengthsM.length;
  const notes: string[] = [];

  const haH = new Float64Array(nS);
  for (let s = 0; s < nS; s++) {
    haH[s] = request.hourAnglesH ? request.hourAnglesH[s] : roundTo(samples.haRad[s] * RAD_TO_HOUR, 6);
  }

  const sampleList: CoverageSample[] = new Array(nS);
  for (let s = 0; s < nS; s++) {
    const elDeg = samples.elevationRad[s] * RAD_TO_DEG;
    const am = airmassKastenYoung(elDeg);
    const item: CoverageSample = {
      hourAngleH: haH[s],
      elevationDeg: roundTo(elDeg, 4),
      observable: observability.observable[s] === 1,
      reason: observability.reasons[s],
      airmass: Number.isFinite(am) ? roundTo(am, 4) : null,
    };
    if (samples.jd && samples.sunAltitudeRad) {
      item.utc = isoUtcFromJulianDay(samples.jd[s]);
      item.lstH = roundTo(lmstHours(samples.jd[s], obs.lonEastRad), 6);
      item.sunAltitudeDeg = roundTo(samples.sunAltitudeRad[s] * RAD_TO_DEG, 3);
    }
    sampleList[s] = item;
  }

  const observableIdx: number[] = [];
  for (let s = 0; s < nS; s++) if (observability.observable[s]) observableIdx.push(s);
  if (nS === 0) notes.push("no samples: the Sun never gets below -18° on this night at this site");
  else if (observableIdx.length === 0) notes.push("no observable sample: no uv points, closure phases or beam");

  const baselineList: CoverageBaseline[] = new Array(nB);
  for (let b = 0; b < nB; b++) {
    const points: CoverageBaseline["points"] = new Array(observableIdx.length);
    for (let q = 0; q < observableIdx.length; q++) {
      const s = observableIdx[q];
      const k = b * nS + s;
      const v2 = new Array<number>(nC);
      const off = k * nC;
      for (let c = 0; c < nC; c++) v2[c] = vis2[off + c];
      points[q] = {
        hourAngleH: haH[s],
        uM: roundTo(tracks.uM[k], 6),
        vM: roundTo(tracks.vM[k], 6),
        wM: roundTo(tracks.wM[k], 6),
        vis2: v2,
      };
    }
    const i = baselines.first[b];
    const j = baselines.second[b];
    const ds = request.stations;
    baselineList[b] = {
      stations: [stationNames[i], stationNames[j]],
      lengthM: roundTo(Math.hypot(ds[j].eastM - ds[i].eastM, ds[j].northM - ds[i].northM, ds[j].upM - ds[i].upM), 6),
      points,
    };
  }

  const closureList: CoverageClosure[] = new Array(triangles.count);
  for (let t = 0; t < triangles.count; t++) {
    const points: CoverageClosure["points"] = new Array(observableIdx.length);
    for (let q = 0; q < observableIdx.length; q++) {
      const s = observableIdx[q];
      const off = (t * nS + s) * nC;
      const cp = new Array<number>(nC);
      for (let c = 0; c < nC; c++) {
        let deg = roundTo(closurePhaseRad[off + c] * RAD_TO_DEG, 6);
        if (deg === -180) deg = 180;
        cp[c] = deg;
      }
      points[q] = { hourAngleH: haH[s], closurePhaseDeg: cp };
    }
    closureList[t] = {
      stations: [stationNames[triangles.i[t]], stationNames[triangles.j[t]], stationNames[triangles.k[t]]],
      points,
    };
  }

  let beam: CoverageBeam | null = null;
  if (request.beam !== null && observableIdx.length > 0) {
    const count = nB * observableIdx.length * nC;
    const [uW, vW, re, im] = float64Arrays(4, count);
    let p = 0;
    for (let b = 0; b < nB; b++)
      for (const s of observableIdx) {
        const off = (b * nS + s) * nC;
        for (let c = 0; c < nC; c++) {
          uW[p] = cube.uW[off + c];
          vW[p] = cube.vW[off + c];
          re[p] = cube.re[off + c];
          im[p] = cube.im[off + c];
          p++;
        }
      }
    if (maxUvRadius(uW, vW) > 0) {
      const opts = request.beam;
      const imager = new HermitianImager(opts.gridSize);
      const result = dirtyBeam(uW, vW, {
        gridSize: opts.gridSize,
        weighting: opts.weighting,
        robust: opts.robust,
        imager,
      });
      const fit = result.fit;
      beam = {
        fwhmMajorMas: fit.fwhmMajorRad === null ? null : roundTo(fit.fwhmMajorRad * RAD_TO_MAS, 6),
        fwhmMinorMas: fit.fwhmMinorRad === null ? null : roundTo(fit.fwhmMinorRad * RAD_TO_MAS, 6),
        positionAngleDeg: fit.positionAngleRad === null ? null : roundTo(fit.positionAngleRad * RAD_TO_DEG, 3),
        peakSidelobe: roundTo(fit.peakSidelobe, 6),
        gridSize: opts.gridSize,
        weighting: opts.weighting,
        robust: opts.robust,
        pixelMas: result.pixelRad * RAD_TO_MAS,
        fieldOfViewMas: result.pixelRad * RAD_TO_MAS * opts.gridSize,
        uvPointCount: result.pointsGridded,
      };
      if (fit.fwhmMajorRad === null)
        notes.push("beam FWHM undefined: the main lobe does not fall to half power within the image");
      if (opts.includeImages) {
        const img = dirtyImage(result.weights, re, im, imager);
        beam.image = Array.from(result.image, (x) => roundTo(x, 6));
        beam.dirtyImage = Array.from(img.image, (x) => roundTo(x, 6));
      }
    } else {
      notes.push("all observable baselines have zero length: beam not computed");
    }
  }

  const figures = coverageFigures(tracks, observability.observable, wavelengthsM);
  const round = (x: number | null, d: number) => (x === null ? null : roundTo(x, d));

  let night: CoverageNight | null = null;
  if (samples.night && request.night) {
    const ev = samples.night;
    const win = starWindow(
      samples.raRad,
      samples.decRad,
      obs.latRad,
      obs.lonEastRad,
      obs.minElevationRad,
      ev.localMidnightJd,
    );
    const iso = (jd: number | null) => (jd === null ? null : isoUtcFromJulianDay(jd));
    night = {
      date: request.night.date,
      sunsetUtc: iso(ev.sunsetJd),
      astronomicalDuskUtc: iso(ev.astronomicalDuskJd),
      astronomicalDawnUtc: iso(ev.astronomicalDawnJd),
      sunriseUtc: iso(ev.sunriseJd),
      targetRiseUtc: iso(win.riseJd),
      targetTransitUtc: isoUtcFromJulianDay(win.transitJd),
      targetSetUtc: iso(win.setJd),
      raOfDateDeg: roundTo(samples.raRad * RAD_TO_DEG, 6),
      decOfDateDeg: roundTo(samples.decRad * RAD_TO_DEG, 6),
    };
  }

  return {
    samples: sampleList,
    baselines: baselineList,
    closurePhases: closureList,
    beam,
    wavelengthsM: [...wavelengthsM],
    independentClosurePhases: independentClosurePhaseCount(stationNames.length),
    figures: {
      ...figures,
      longestBaselineM: round(figures.longestBaselineM, 6),
      shortestBaselineM: round(figures.shortestBaselineM, 6),
      resolutionMas: round(figures.resolutionMas, 6),
      largestAngularScaleMas: round(figures.largestAngularScaleMas, 6),
      radialCoverage: roundTo(figures.radialCoverage, 4),
      positionAngleCoverage: roundTo(figures.positionAngleCoverage, 4),
      observableHours: roundTo(figures.observableSamples * samples.sampleDurationH, 4),
    },
    night,
    notes,
  };
}
