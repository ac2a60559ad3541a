/**
 * Estimates from V and B−V alone: the angular diameter, and the magnitude in the observing band. Both
 * come from the dwarf colour sequence of Pecaut & Mamajek (2013), Table 5 (colour-table.ts).
 *
 * Angular diameter — effective temperature + bolometric correction route. For a star of V magnitude V,
 * effective temperature T and bolometric correction BC_V,
 *   f_bol = f0 · 10^(−0.4 (V + BC_V)),   θ = 2 √(f_bol / (σ T⁴))   (radians)
 * with f0 = 2.518021002 × 10⁻⁸ W m⁻² the irradiance of apparent bolometric magnitude 0 (IAU 2015
 * Resolution B2) and σ = 5.670374419 × 10⁻⁸ W m⁻² K⁻⁴ (CODATA 2018) — both constants from memory; the
 * tests confirm them by reproducing the table's own radii. T and BC_V are those of the table at the
 * star's B−V; the zero-magnitude diameter log θ(V=0) is interpolated linearly in B−V between rows and
 * θ = θ(V=0) · 10^(−0.2 V). Valid for B−V from −0.301 (B0V) to 1.505 (M2V); refused outside.
 *
 * Band magnitude: m_X = V − (V−X), (V−X) interpolated in the table (V−J = V−Ks − (H−Ks) − (J−H),
 * V−H = V−Ks − (H−Ks)). Bands and their central wavelengths (from memory: Bessell 2005, ARA&A 43, 293,
 * for V, Rc, Ic; Cohen, Wheaton & Megeath 2003, AJ 126, 1090, for 2MASS J, H, Ks); a wavelength maps to
 * the band of nearest central wavelength.
 *
 * Uncertainties (1σ) combine the B−V error propagated through the table's slope and an allowance for
 * what V and B−V cannot tell (luminosity class, metallicity, reddening). The data carry no photometric
 * errors, so B−V is taken as good to ±0.02 mag; the allowance is 5 % in diameter and 0.05 mag in band
 * magnitude. These three numbers are project choices, not published values. Applied to red giants
 * (B−V beyond about 1.2) the dwarf sequence overestimates diameters (from memory: a K giant is hotter
 * than the M dwarf of its B−V), which errs on the safe side for calibrator selection.
 */
import { RAD_TO_MAS } from "../math";
import { DWARF_COLOURS, interpolateColumn } from "./colour-table";

/** Irradiance of apparent bolometric magnitude 0, W m⁻² (IAU 2015 Resolution B2; from memory). */
export const BOLOMETRIC_ZERO_POINT_W_M2 = 2.518021002e-8;
/** Stefan–Boltzmann constant, W m⁻² K⁻⁴ (CODATA 2018; from memory). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;
/** B−V range of the estimates: the table rows B0V … M2V. */
export const ESTIMATE_BV_RANGE = { min: -0.301, max: 1.505 } as const;
/** Assumed 1σ error of a B−V colour of the data, mag (project choice). */
export const ASSUMED_BV_ERROR_MAG = 0.02;
/** Relative 1σ allowance of a diameter estimate for unknown class, metallicity, reddening (project choice). */
export const DIAMETER_ALLOWANCE = 0.05;
/** 1σ allowance of a band-magnitude estimate, mag (project choice). */
export const BAND_MAG_ALLOWANCE = 0.05;

export type BandName = "V" | "Rc" | "Ic" | "J" | "H" | "Ks";

export interface Band {
  name: BandName;
  centralWavelengthM: number;
}

/** The bands of the colour table, blue to red. */
export const BANDS: readonly Band[] = [
  { name: "V", centralWavelengthM: 0.545e-6 },
  { name: "Rc", centralWavelengthM: 0.641e-6 },
  { name: "Ic", centralWavelengthM: 0.798e-6 },
  { name: "J", centralWavelengthM: 1.235e-6 },
  { name: "H", centralWavelengthM: 1.662e-6 },
  { name: "Ks", centralWavelengthM: 2.159e-6 },
];

/** The band whose central wavelength is nearest to wavelengthM (metres, > 0). */
export function bandForWavelength(wavelengthM: number): Band {
  let best = BANDS[0];
  for (const b of BANDS) {
    if (Math.abs(b.centralWavelengthM - wavelengthM) < Math.abs(best.centralWavelengthM - wavelengthM)) best = b;
  }
  return best;
}

/** An estimate with its 1σ uncertainty, or the reason there is none. */
export type Estimate = { ok: true; value: number; uncertainty: number } | { ok: false; reason: string };

const T = DWARF_COLOURS;
/** log10 of the zero-magnitude angular diameter (mas) at each row, from Teff and BC_V. */
const LOG_THETA0 = Float64Array.from(T.teffK, (teff, i) => {
  const fBol = BOLOMETRIC_ZERO_POINT_W_M2 * 10 ** (-0.4 * T.bcV[i]);
  return Math.log10(2 * Math.sqrt(fBol / (STEFAN_BOLTZMANN * teff ** 4)) * RAD_TO_MAS);
});
const V_MINUS: Record<BandName, Float64Array> = {
  V: new Float64Array(T.bv.length),
  Rc: T.vMinusRc,
  Ic: T.vMinusIc,
  J: Float64Array.from(T.vMinusKs, (vk, i) => vk - T.hMinusKs[i] - T.jMinusH[i]),
  H: Float64Array.from(T.vMinusKs, (vk, i) => vk - T.hMinusKs[i]),
  Ks: T.vMinusKs,
};

function colourRefusal(bv: number): string | null {
  if (!Number.isFinite(bv)) return "no B−V colour in the catalogue";
  if (bv < ESTIMATE_BV_RANGE.min) {
    return `B−V ${bv.toFixed(3)} is bluer than the relation's range (${ESTIMATE_BV_RANGE.min} to ${ESTIMATE_BV_RANGE.max})`;
  }
  if (bv > ESTIMATE_BV_RANGE.max) {
    return `B−V ${bv.toFixed(3)} is redder than the relation's range (${ESTIMATE_BV_RANGE.min} to ${ESTIMATE_BV_RANGE.max})`;
  }
  return null;
}

/**
 * Estimated limb-darkened angular diameter, mas, from V and B−V (see the file comment).
 * @returns the estimate and its 1σ uncertainty (mas), or a reason when B−V is missing or out of range
 */
export function estimateDiameterMas(vMag: number, bv: number): Estimate {
  const refusal = colourRefusal(bv);
  if (refusal) return { ok: false, reason: refusal };
  const { value: logTheta0, slope } = interpolateColumn(LOG_THETA0, bv);
  const value = 10 ** (logTheta0 - 0.2 * vMag);
  const fromColour = Math.LN10 * Math.abs(slope) * ASSUMED_BV_ERROR_MAG;
  return { ok: true, value, uncertainty: value * Math.hypot(fromColour, DIAMETER_ALLOWANCE) };
}

/**
 * Estimated magnitude in a band from V and B−V. The V band returns V itself with no uncertainty.
 * @returns the estimate and its 1σ uncertainty (mag), or a reason when B−V is missing or out of range
 */
export function estimateBandMagnitude(vMag: number, bv: number, band: BandName): Estimate {
  if (band === "V") return { ok: true, value: vMag, uncertainty: 0 };
  const refusal = colourRefusal(bv);
  if (refusal) return { ok: false, reason: refusal };
  const { value, slope } = interpolateColumn(V_MINUS[band], bv);
  if (Number.isNaN(value)) return { ok: false, reason: `no V−${band} colour in the table at B−V ${bv.toFixed(3)}` };
  return {
    ok: true,
    value: vMag - value,
    uncertainty: Math.hypot(Math.abs(slope) * ASSUMED_BV_ERROR_MAG, BAND_MAG_ALLOWANCE),
  };
}
