/**
 * LST pressure of a cycle: where in local sidereal time the requested hours fall, against the hours
 * each configuration offers per LST bin.
 *
 * Method.
 *  1. Darkness: the dark intervals of the nights of {@link DarkTime} (every night, or one night per
 *     block of k nights weighted by the block's length) are added to fine LST cells of about
 *     {@link LST_CELL_MIN} minutes: D_c = Σ_nights weight × dark solar hours in cell c. Σ_c D_c is the
 *     period's dark time.
 *  2. Observability of each request (target × configuration): the target's J2000 position precessed
 *     to local midnight of the period's middle night (the ≲ 30″ drift over a cycle is far below a cell);
 *     at each LST the hour angle H = LST − α gives the elevation and the projected baselines, and the engine's observability rules (elevation limit; every baseline within the
 *     delay-line stroke) say when it is observable (rules evaluated at the cell edges; a cell
 *     holding an edge of the window is evaluated on 16 slices, each with its own darkness, so an edge
 *     is placed to ~1/32 of a cell, ~10 s). Because H depends on LST only, the mask is the same on
 *     every night, and the observable time per cell over the period is the darkness of the cell
 *     (or of its observable slices) from step 1. Bins sum their cells.
 *  3. Spread: the requested hours h are spread over the bins in proportion to the observable hours,
 *     s_b = h·O_b / Σ O, so Σ_b s_b = h. A target with Σ O = 0 has all its hours unplaceable (with the
 *     reason) and a zero spread; it is never dropped silently.
 *  4. Capacity of a configuration: nights offered × mean dark hours per bin per night, so
 *     Σ_b capacity = nights × mean dark hours per night.
 */
import { precessFromJ2000 } from "../astro/precession";
import { jdeFromJd, julianDayAt0hUt, parseIsoDate } from "../astro/time";
import { buildBaselines } from "../interferometry/baselines";
import { stationsToEquatorial } from "../interferometry/stations";
import { DEG_TO_RAD, RAD_TO_HOUR, TWO_PI } from "../math";
import { addDarkIntervalToLst, addDays, type DarkTime } from "./dark-time";
import type { LstPressureInput } from "./inputs";
import { EDGE_SUBSAMPLES, observableDarkHours, type PreparedConfiguration } from "./lst-observability";

/** Aimed width of the fine LST cells of the observability masks, minutes of LST. */
export const LST_CELL_MIN = 5;

export interface RequestPressure {
  proposal: string;
  target: string;
  configuration: string;
  hoursRequested: number;
  /** Hours the target is observable in darkness per LST bin, summed over the period's nights. */
  observableHoursPerBin: Float64Array;
  observableHours: number;
  /** Requested hours per LST bin; Σ = hoursRequested − unplaceableHours. */
  spreadHours: Float64Array;
  /** Hours that fall in no bin (never observable, or configuration not offered); 0 or hoursRequested. */
  unplaceableHours: number;
  /** Why the target cannot be placed (even when it requests 0 h); null when it can. */
  unplaceableReason: string | null;
}

export interface ConfigurationPressure {
  configuration: string;
  nights: number;
  /** Hours offered per LST bin: nights × mean dark hours per bin per night. */
  capacityHours: Float64Array;
  /** Σ capacityHours = nights × mean dark hours per night. */
  capacityTotalH: number;
  /** Requested hours per LST bin (Σ of the spreads). */
  requestedHours: Float64Array;
  /** Every hour requested on the configuration, unplaceable ones included. */
  requestedTotalH: number;
  unplaceableH: number;
  /** requestedTotalH / capacityTotalH; null when the configuration offers no time. */
  oversubscription: number | null;
}

export interface LstPressure {
  lstBins: number;
  binWidthH: number;
  /** Width of the fine cells of the observability masks, minutes of LST. */
  cellMin: number;
  /** Nights whose darkness was computed, with the nights each stands for. */
  sampledNights: { date: string; weight: number }[];
  /** The date whose local midnight the target positions are precessed to. */
  positionsOfDate: string;
  /** In request order. */
  requests: RequestPressure[];
  /** In input order. */
  configurations: ConfigurationPressure[];
}

function checkInput(input: LstPressureInput): void {
  const ids = new Set<string>();
  input.configurations.forEach((c, i) => {
    if (ids.has(c.id)) throw new RangeError(`configurations[${i}].id: repeats configuration "${c.id}"`);
    ids.add(c.id);
    if (!(c.nights >= 0) || !Number.isFinite(c.nights))
      throw new RangeError(`configurations[${i}].nights: must be zero or positive`);
    if (!(c.minElevationDeg >= 0 && c.minElevationDeg <= 90))
      throw new RangeError(`configurations[${i}].minElevationDeg: must be between 0 and 90`);
    if (c.delayLineStrokeM !== null && !(c.delayLineStrokeM > 0))
      throw new RangeError(`configurations[${i}].delayLineStrokeM: must be positive or null`);
  });
  input.requests.forEach((r, i) => {
    if (!(r.hours >= 0) || !Number.isFinite(r.hours))
      throw new RangeError(`requests[${i}].hours: must be zero or positive`);
    if (!(r.raDeg >= 0 && r.raDeg <= 360)) throw new RangeError(`requests[${i}].raDeg: must be between 0 and 360`);
    if (!(r.decDeg >= -90 && r.decDeg <= 90)) throw new RangeError(`requests[${i}].decDeg: must be between -90 and 90`);
    const el = r.minElevationDeg;
    if (el !== undefined && el !== null && !(el >= 0 && el <= 90))
      throw new RangeError(`requests[${i}].minElevationDeg: must be between 0 and 90`);
  });
}

/** Computes the LST pressure of `input` over the period and site of `dark`. */
export function lstPressure(dark: DarkTime, input: LstPressureInput): LstPressure {
  checkInput(input);
  const nBins = dark.lstBins;
  const sub = Math.max(1, Math.round((dark.binWidthH * 60) / LST_CELL_MIN));
  const nCells = nBins * sub;
  const cellH = 24 / nCells;
  const latRad = dark.site.latitudeDeg * DEG_TO_RAD;
  const lonEastRad = dark.site.longitudeDeg * DEG_TO_RAD;

  // 1. Darkness per fine cell over the period.
  // Darkness per slice of a cell (EDGE_SUBSAMPLES slices each), for cells that hold a window edge.
  const darkPerSlice = new Float64Array(nCells * EDGE_SUBSAMPLES);
  for (const n of dark.nights) {
    if (n.lstAtDarkStartH !== null) addDarkIntervalToLst(n.lstAtDarkStartH, n.darkHours, darkPerSlice, n.weight);
  }
  const darkPerCell = new Float64Array(nCells);
  for (let i = 0; i < darkPerSlice.length; i++) darkPerCell[Math.floor(i / EDGE_SUBSAMPLES)] += darkPerSlice[i];
  let periodDarkH = 0;
  for (let c = 0; c < nCells; c++) periodDarkH += darkPerCell[c];
  const darkness = { perCell: darkPerCell, perSlice: darkPerSlice };

  // Positions of date: local mean midnight of the period's middle night.
  const positionsOfDate = addDays(dark.firstNight, Math.floor((dark.periodNights - 1) / 2));
  const midnightJd = julianDayAt0hUt(parseIsoDate(positionsOfDate)!) + 1 - lonEastRad / TWO_PI;
  const jde = jdeFromJd(midnightJd);

  const prepared = new Map<string, PreparedConfiguration>();
  for (const config of input.configurations) {
    const xyz = stationsToEquatorial(config.stations, latRad);
    prepared.set(config.id, {
      config,
      stationNames: config.stations.map((st) => st.name),
      baselines: buildBaselines(
        xyz,
        config.stations.map((s) => s.pathOffsetM),
      ),
    });
  }

  const requests = input.requests.map((req): RequestPressure => {
    const out: RequestPressure = {
      proposal: req.proposal,
      target: req.target,
      configuration: req.configuration,
      hoursRequested: req.hours,
      observableHoursPerBin: new Float64Array(nBins),
      observableHours: 0,
      spreadHours: new Float64Array(nBins),
      unplaceableHours: 0,
      unplaceableReason: null,
    };
    const prep = prepared.get(req.configuration);
    if (!prep) return unplaceable(out, `configuration "${req.configuration}" is not offered in this cycle`);
    const minElevationDeg = req.minElevationDeg ?? prep.config.minElevationDeg;
    const pos = precessFromJ2000(req.raDeg * DEG_TO_RAD, req.decDeg * DEG_TO_RAD, jde);
    const f = observableDarkHours(
      prep,
      pos.raRad * RAD_TO_HOUR,
      pos.decRad,
      latRad,
      minElevationDeg * DEG_TO_RAD,
      darkness,
    );
    const skyH = f.skyH;
    for (let c = 0; c < nCells; c++) out.observableHoursPerBin[Math.floor(c / sub)] += f.observablePerCell[c];
    for (let b = 0; b < nBins; b++) out.observableHours += out.observableHoursPerBin[b];
    if (!(out.observableHours > 0)) {
      const why =
        periodDarkH === 0
          ? "there is no astronomical darkness in the period"
          : skyH === 0
            ? `never above ${minElevationDeg}° in darkness during the period`
            : "the delay lines never reach it while it is up in darkness";
      return unplaceable(out, why);
    }
    const scale = req.hours / out.observableHours;
    for (let b = 0; b < nBins; b++) out.spreadHours[b] = scale * out.observableHoursPerBin[b];
    return out;
  });

  const configurations = input.configurations.map((config): ConfigurationPressure => {
    const capacityHours = new Float64Array(nBins);
    for (let b = 0; b < nBins; b++) capacityHours[b] = config.nights * dark.meanDarkHoursPerBin[b];
    const requestedHours = new Float64Array(nBins);
    let requestedTotalH = 0;
    let unplaceableH = 0;
    for (const r of requests) {
      if (r.configuration !== config.id) continue;
      requestedTotalH += r.hoursRequested;
      unplaceableH += r.unplaceableHours;
      for (let b = 0; b < nBins; b++) requestedHours[b] += r.spreadHours[b];
    }
    const capacityTotalH = config.nights * dark.meanDarkHoursPerNight;
    return {
      configuration: config.id,
      nights: config.nights,
      capacityHours,
      capacityTotalH,
      requestedHours,
      requestedTotalH,
      unplaceableH,
      oversubscription: capacityTotalH > 0 ? requestedTotalH / capacityTotalH : null,
    };
  });

  return {
    lstBins: nBins,
    binWidthH: dark.binWidthH,
    cellMin: cellH * 60,
    sampledNights: dark.nights.map((n) => ({ date: n.date, weight: n.weight })),
    positionsOfDate,
    requests,
    configurations,
  };
}

function unplaceable(out: RequestPressure, reason: string): RequestPressure {
  out.unplaceableHours = out.hoursRequested;
  out.unplaceableReason = reason;
  return out;
}
