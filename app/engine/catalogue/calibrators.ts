/**
 * `cli calibrators`: the catalogue stars that would calibrate a target, best first.
 *
 * A star is listed when
 *  1. it lies within maxDistanceDeg of the target (J2000 great-circle distance) and is not the target:
 *     the star the target names, and every star within TARGET_MATCH_ARCSEC of the target position (the
 *     target itself typed with rounded coordinates, or a companion too close to point at separately);
 *  2. V and B−V give a diameter estimate (B−V inside the relation's range, estimates.ts);
 *  3. the uniform-disk V² of that diameter at longestBaselineM and wavelengthM is at least minVis2;
 *  4. its band magnitude passes bandLimitMag and lies within maxMagDifference of the target's (each rule
 *     only when given; the target's band magnitude is the request's, else estimated when the target is a
 *     catalogue star);
 *  5. it is above minElevationDeg at the same time as the target for at least one sample of the
 *     astronomical night, sampled every 10 minutes as the Sketchpad does (positions precessed to the
 *     night, as `coverage` does).
 * Order: score (score.ts) descending, then distance, then HIP number.
 */
import { elevationRad } from "../astro/horizon";
import { precessFromJ2000 } from "../astro/precession";
import { lmstRad } from "../astro/sidereal";
import { isoUtcFromJulianDay, jdeFromJd, parseIsoDate } from "../astro/time";
import { compileModel, visibilityAt } from "../interferometry/models";
import { samplesAcrossNight } from "../interferometry/sampling";
import { DEG_TO_RAD, RAD_TO_DEG, roundTo } from "../math";
import { displayName, type StarCatalogue, VARIABILITY } from "./build";
import { bandForWavelength, estimateBandMagnitude, estimateDiameterMas } from "./estimates";
import { lookupStar } from "./lookup";
import { unknownNameMessage } from "./resolve";
import { calibratorScore, SCORING_TEXT } from "./score";
import type { CalibratorEntry, CalibratorsInput, CalibratorsResponse } from "./types";

/** Stars this close to the target position are taken as the target itself, arcseconds. */
export const TARGET_MATCH_ARCSEC = 60;
/** Night sampling step, minutes. */
export const NIGHT_STEP_MIN = 10;

/** Great-circle distance between unit vectors, radians (chord formula, accurate at small angles). */
function separationRad(ax: number, ay: number, az: number, bx: number, by: number, bz: number): number {
  const dx = ax - bx;
  const dy = ay - by;
  const dz = az - bz;
  return 2 * Math.asin(Math.min(1, Math.sqrt(dx * dx + dy * dy + dz * dz) / 2));
}

/**
 * The precession from J2000.0 to an instant as a rotation matrix (row-major 3×3): the images of the
 * three basis vectors under the engine's precession, which is a rotation (Meeus eq. 21.4).
 */
function precessionMatrix(jde: number): Float64Array {
  const m = new Float64Array(9);
  const basis: [number, number][] = [
    [0, 0],
    [Math.PI / 2, 0],
    [0, Math.PI / 2],
  ];
  basis.forEach(([ra, dec], col) => {
    const p = precessFromJ2000(ra, dec, jde);
    m[col] = Math.cos(p.decRad) * Math.cos(p.raRad);
    m[3 + col] = Math.cos(p.decRad) * Math.sin(p.raRad);
    m[6 + col] = Math.sin(p.decRad);
  });
  return m;
}

/** Uniform-disk V² of a diameter (mas) on a baseline (m) at a wavelength (m), by the engine's model code. */
export function uniformDiskVis2(diameterMas: number, baselineM: number, wavelengthM: number): number {
  const v = visibilityAt(compileModel({ type: "uniformDisk", diameterMas }), baselineM / wavelengthM, 0);
  return v.re * v.re + v.im * v.im;
}

export type CalibratorsResult =
  | { ok: true; value: CalibratorsResponse }
  | { ok: false; field: string; message: string };

/** The shortlist of a validated request (see the file comment). */
export function shortlistCalibrators(catalogue: StarCatalogue, input: CalibratorsInput): CalibratorsResult {
  // ---- the target
  let targetRow = -1;
  let raRad: number;
  let decRad: number;
  if ("name" in input.target) {
    const hit = lookupStar(catalogue, input.target.name);
    if (!hit.found) {
      return { ok: false, field: "target.name", message: unknownNameMessage(input.target.name, hit.suggestions) };
    }
    targetRow = hit.row;
    raRad = catalogue.raRad[targetRow];
    decRad = catalogue.decRad[targetRow];
  } else {
    raRad = input.target.raDeg * DEG_TO_RAD;
    decRad = input.target.decDeg * DEG_TO_RAD;
  }
  const tx = Math.cos(decRad) * Math.cos(raRad);
  const ty = Math.cos(decRad) * Math.sin(raRad);
  const tz = Math.sin(decRad);
  const matchRad = (TARGET_MATCH_ARCSEC / 3600) * DEG_TO_RAD;
  const maxRad = input.maxDistanceDeg * DEG_TO_RAD;
  const candidates: { row: number; distanceRad: number }[] = [];
  let excludedTarget = 0;
  let nearest = { row: -1, rad: Number.POSITIVE_INFINITY };
  const cosMax = Math.cos(maxRad) - 1e-12;
  for (let row = 0; row < catalogue.size; row++) {
    const ux = catalogue.unitX[row];
    const uy = catalogue.unitY[row];
    const uz = catalogue.unitZ[row];
    if (ux * tx + uy * ty + uz * tz < cosMax) continue;
    const d = separationRad(ux, uy, uz, tx, ty, tz);
    if (d > maxRad) continue;
    if (d < nearest.rad) nearest = { row, rad: d };
    if (row === targetRow || d <= matchRad) excludedTarget++;
    else candidates.push({ row, distanceRad: d });
  }
  if (targetRow < 0 && nearest.rad <= matchRad) targetRow = nearest.row;

  const band = bandForWavelength(input.wavelengthM);
  const warnings: string[] = [];
  if (input.wavelengthM > 2.5e-6) warnings.push(`wavelength beyond Ks: band magnitudes are Ks estimates`);
  let targetBand: number | null = input.target.bandMag;
  let bandMagSource: "request" | "estimate" | null = targetBand === null ? null : "request";
  if (targetBand === null && targetRow >= 0) {
    const e = estimateBandMagnitude(catalogue.vMag[targetRow], catalogue.bv[targetRow], band.name);
    if (e.ok) {
      targetBand = e.value;
      bandMagSource = "estimate";
    }
  }

  // ---- the night
  const latRad = input.site.latitudeDeg * DEG_TO_RAD;
  const lonRad = input.site.longitudeDeg * DEG_TO_RAD;
  const date = parseIsoDate(input.date);
  if (!date) return { ok: false, field: "date", message: "must be a real calendar date" };
  const samples = samplesAcrossNight(date, NIGHT_STEP_MIN, raRad, decRad, latRad, lonRad);
  const minElRad = input.minElevationDeg * DEG_TO_RAD;
  const nS = samples.haRad.length;
  const jd = samples.jd ?? new Float64Array(0);
  const targetUp = new Uint8Array(nS);
  let targetSamples = 0;
  for (let s = 0; s < nS; s++) {
    targetUp[s] = samples.elevationRad[s] >= minElRad ? 1 : 0;
    targetSamples += targetUp[s];
  }
  const stepH = NIGHT_STEP_MIN / 60;
  const targetHours = targetSamples * stepH;
  if (nS === 0) warnings.push(`the Sun does not get 18° below the horizon on the night of ${input.date}`);
  else if (targetSamples === 0) {
    warnings.push(`the target is never above ${input.minElevationDeg}° during the astronomical night of ${input.date}`);
  }
  const lmst = Float64Array.from(jd, (t) => lmstRad(t, lonRad));
  const precession = precessionMatrix(samples.night ? jdeFromJd(samples.night.localMidnightJd) : 2451545);

  // ---- the candidates
  const excluded = {
    target: excludedTarget,
    noColour: 0,
    colourOutOfRange: 0,
    resolved: 0,
    magnitude: 0,
    notTogether: 0,
  };
  const kept: (CalibratorEntry & { rawScore: number; distanceRad: number })[] = [];
  const wavelengthUm = (input.wavelengthM * 1e6).toPrecision(3);
  for (const { row, distanceRad } of candidates) {
    const v = catalogue.vMag[row];
    const bv = catalogue.bv[row];
    const diameter = estimateDiameterMas(v, bv);
    if (!diameter.ok) {
      if (Number.isNaN(bv)) excluded.noColour++;
      else excluded.colourOutOfRange++;
      continue;
    }
    const vis2 = uniformDiskVis2(diameter.value, input.longestBaselineM, input.wavelengthM);
    if (!(vis2 >= input.minVis2)) {
      excluded.resolved++;
      continue;
    }
    const bandMag = estimateBandMagnitude(v, bv, band.name);
    const m = bandMag.ok ? bandMag.value : null;
    const magDifference = m !== null && targetBand !== null ? Math.abs(m - targetBand) : null;
    if (
      (input.bandLimitMag !== null && (m === null || m > input.bandLimitMag)) ||
      (input.maxMagDifference !== null && magDifference !== null && magDifference > input.maxMagDifference)
    ) {
      excluded.magnitude++;
      continue;
    }
    let together = 0;
    if (targetSamples > 0) {
      const m = precession;
      const [ux, uy, uz] = [catalogue.unitX[row], catalogue.unitY[row], catalogue.unitZ[row]];
      const x = m[0] * ux + m[1] * uy + m[2] * uz;
      const y = m[3] * ux + m[4] * uy + m[5] * uz;
      const z = m[6] * ux + m[7] * uy + m[8] * uz;
      const raOfDate = Math.atan2(y, x);
      const decOfDate = Math.asin(Math.max(-1, Math.min(1, z)));
      for (let s = 0; s < nS; s++) {
        if (targetUp[s] && elevationRad(latRad, decOfDate, lmst[s] - raOfDate) >= minElRad) together++;
      }
    }
    if (together === 0) {
      excluded.notTogether++;
      continue;
    }
    const hours = together * stepH;
    const distanceDeg = distanceRad * RAD_TO_DEG;
    const rawScore = calibratorScore({
      distanceDeg,
      maxDistanceDeg: input.maxDistanceDeg,
      vis2,
      minVis2: input.minVis2,
      hoursTogether: hours,
      targetHours,
      magDifference,
      maxMagDifference: input.maxMagDifference,
    });
    const reasons = [
      `${distanceDeg.toFixed(2)}° from the target`,
      `V² ${vis2.toFixed(3)} at ${input.longestBaselineM} m and ${wavelengthUm} µm for a uniform disk of ${diameter.value.toFixed(3)} ± ${diameter.uncertainty.toFixed(3)} mas (estimate from V and B−V)`,
      m === null
        ? `no ${band.name} magnitude estimate`
        : `${band.name} ${m.toFixed(2)} ± ${bandMag.ok ? bandMag.uncertainty.toFixed(2) : "?"} (estimate)` +
          (magDifference === null ? "" : `, ${magDifference.toFixed(2)} mag from the target's`),
      `above ${input.minElevationDeg}° with the target for ${hours.toFixed(2)} h of ${targetHours.toFixed(2)} h`,
    ];
    const names = catalogue.names.get(row);
    if (catalogue.variability[row] === VARIABILITY.variable) {
      reasons.push(`variable star${names?.variable ? ` (${names.variable})` : ""}: check its amplitude`);
    } else if (catalogue.variability[row] === VARIABILITY.suspected) reasons.push("suspected variable (NSV)");
    kept.push({
      name: displayName(catalogue, row),
      hip: catalogue.hip[row],
      raDeg: roundTo(catalogue.raRad[row] * RAD_TO_DEG, 4),
      decDeg: roundTo(catalogue.decRad[row] * RAD_TO_DEG, 4),
      distanceDeg: roundTo(distanceDeg, 3),
      vMag: v,
      bv,
      bandMag: m === null ? null : roundTo(m, 2),
      bandMagErr: bandMag.ok ? roundTo(bandMag.uncertainty, 2) : null,
      diameterMas: roundTo(diameter.value, 3),
      diameterErrMas: roundTo(diameter.uncertainty, 3),
      vis2: roundTo(vis2, 4),
      observableHours: roundTo(hours, 2),
      score: roundTo(rawScore, 1),
      reasons,
      rawScore,
      distanceRad,
    });
  }
  kept.sort((a, b) => b.rawScore - a.rawScore || a.distanceRad - b.distanceRad || a.hip - b.hip);

  const targetBv = targetRow >= 0 ? catalogue.bv[targetRow] : Number.NaN;
  return {
    ok: true,
    value: {
      target: {
        name: targetRow >= 0 ? displayName(catalogue, targetRow) : null,
        hip: targetRow >= 0 ? catalogue.hip[targetRow] : null,
        raDeg: roundTo(raRad * RAD_TO_DEG, 6),
        decDeg: roundTo(decRad * RAD_TO_DEG, 6),
        vMag: targetRow >= 0 ? catalogue.vMag[targetRow] : null,
        bv: Number.isNaN(targetBv) ? null : targetBv,
        bandMag: targetBand === null ? null : roundTo(targetBand, 2),
        bandMagSource,
        observableHours: roundTo(targetHours, 2),
      },
      band: { name: band.name, centralWavelengthM: band.centralWavelengthM },
      night: {
        astronomicalDuskUtc: samples.night?.darkStartJd ? isoUtcFromJulianDay(samples.night.darkStartJd) : null,
        astronomicalDawnUtc: samples.night?.darkEndJd ? isoUtcFromJulianDay(samples.night.darkEndJd) : null,
        stepMin: NIGHT_STEP_MIN,
      },
      calibrators: kept.slice(0, input.limit).map(({ rawScore: _s, distanceRad: _d, ...entry }) => entry),
      excluded,
      candidates: kept.length,
      warnings,
      scoring: SCORING_TEXT,
    },
  };
}
