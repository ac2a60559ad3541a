/**
 * Shared first stage of the coverage and triangle computations: resolve the
 * request into radians, sample hour angles, build baselines and uv tracks and
 * assess observability.
 */

import { parseIsoDate } from "../astro/time";
import type { ObservationInput } from "../inputs";
import { DEG_TO_RAD } from "../math";
import { type BaselineSet, buildBaselines } from "./baselines";
import { type CompiledModel, compileModel } from "./models";
import { assessObservability, type Observability } from "./observability";
import { type HourAngleSamples, samplesAcrossNight, samplesFromHourAngles } from "./sampling";
import { stationsToEquatorial } from "./stations";
import { computeUvwTracks, type UvwTracks } from "./uv-tracks";

export interface PreparedObservation {
  stationNames: string[];
  latRad: number;
  lonEastRad: number;
  minElevationRad: number;
  wavelengthsM: number[];
  model: CompiledModel;
  baselines: BaselineSet;
  samples: HourAngleSamples;
  tracks: UvwTracks;
  observability: Observability;
}

/** Runs the first stage on a validated request. */
export function prepareObservation(request: ObservationInput): PreparedObservation {
  const latRad = request.site.latitudeDeg * DEG_TO_RAD;
  const lonEastRad = request.site.longitudeDeg * DEG_TO_RAD;
  const minElevationRad = request.minElevationDeg * DEG_TO_RAD;
  const raRad = request.target.raDeg * DEG_TO_RAD;
  const decRad = request.target.decDeg * DEG_TO_RAD;

  let samples: HourAngleSamples;
  if (request.hourAnglesH) {
    samples = samplesFromHourAngles(request.hourAnglesH, raRad, decRad, latRad);
  } else if (request.night) {
    const date = parseIsoDate(request.night.date);
    if (!date) throw new RangeError(`invalid night.date ${request.night.date}`);
    samples = samplesAcrossNight(date, request.night.stepMin, raRad, decRad, latRad, lonEastRad);
  } else {
    throw new RangeError("a request needs hourAnglesH or night");
  }

  const xyz = stationsToEquatorial(request.stations, latRad);
  const baselines = buildBaselines(
    xyz,
    request.stations.map((s) => s.pathOffsetM),
  );
  const tracks = computeUvwTracks(baselines, samples.haRad, samples.decRad);
  const stationNames = request.stations.map((s) => s.name);
  const observability = assessObservability({
    elevationRad: samples.elevationRad,
    minElevationRad,
    sunAltitudeRad: samples.sunAltitudeRad,
    tracks,
    baselines,
    stationNames,
    delayLineStrokeM: request.delayLineStrokeM,
  });
  return {
    stationNames,
    latRad,
    lonEastRad,
    minElevationRad,
    wavelengthsM: request.wavelengthsM,
    model: compileModel(request.target.model),
    baselines,
    samples,
    tracks,
    observability,
  };
}
