/**
 * The simulated data as an OIFITS 2 file (Duvert, Young & Hummel 2017, A&A 597, A8), as bytes.
 *
 * Layout: a primary HDU without data carrying the main-header keywords of the paper's Table 2 (all the
 * mandatory ones — ORIGIN, DATE, DATE-OBS, CONTENT = 'OIFITS2', TELESCOP, INSTRUME, OBSERVER, OBJECT,
 * INSMODE — plus RA, DEC, EQUINOX, MJD-OBS, MJD-END, BASE_MIN, BASE_MAX, WAVELMIN, WAVELMAX, NUM_CHAN),
 * then five binary tables, each with OI_REVN = 2 and every column of its table in the paper:
 *  - OI_TARGET (Table 3): one target, TARGET_ID 1, J2000 position, CATEGORY 'SCI';
 *  - OI_ARRAY (Table 4): ARRNAME, FRAME = 'GEOCENTRIC', ARRAYX/Y/Z the WGS 84 position of the site; one row
 *    per station (STA_INDEX from 1 in request order), STAXYZ its offset, DIAMETER and FOV = λ_max/D
 *    (FOVTYPE 'FWHM') from the request's descriptive fields;
 *  - OI_WAVELENGTH (Table 5): one row per channel; EFF_BAND the spacing of adjacent channels (0 for a
 *    single channel: the simulation is monochromatic);
 *  - OI_VIS2 (Table 6): one row per baseline and observable sample, NWAVE = channels;
 *  - OI_T3 (Table 8): one row per triangle and observable sample; T3AMP and T3AMPERR are not simulated
 *    and hold NaN (the FITS undefined floating-point value); TIME is 0 as the paper asks.
 * All FLAG values are F. Instants: MJD = JD − 2400000.5 of each sample (nominal instants for an
 * hour-angle list, see simulate.ts).
 */
import { isoUtcFromJulianDay } from "../astro/time";
import { DEG_TO_RAD, RAD_TO_DEG, RAD_TO_MAS } from "../math";
import { type BinaryColumn, binaryTableHdu, concatBytes, type FitsCard, primaryHdu } from "./fits";
import { enuToEcefOffset, geodeticToEcef } from "./geocentric";
import type { SimulateInput } from "./inputs";
import type { SimulatedData } from "./simulate";

const MJD_OFFSET = 2400000.5;

const int = (x: number) => ({ int: x });
const real = (x: number) => ({ real: x });

/**
 * Writes the OIFITS 2 bytes of simulated data.
 * @param request the validated simulate request the data came from (site, stations, target, OIFITS fields)
 * @param writtenUtc value of the DATE keyword (ISO-8601 UTC), passed in so the function stays pure
 */
export function oifitsBytes(data: SimulatedData, request: SimulateInput, writtenUtc: string): Uint8Array {
  const { arrayName, instrumentName, telescopeDiameterM } = request.oifits;
  const nQ = data.hourAngleH.length;
  const nC = data.wavelengthsM.length;
  const nB = data.baselineFirst.length;
  const nT = data.triA.length;
  const mjd = Array.from(data.jd, (jd) => jd - MJD_OFFSET);
  const dateObs = nQ > 0 ? isoUtcFromJulianDay(data.jd[0]).replace(/Z$/, "") : writtenUtc.replace(/Z$/, "");
  const targetName = (request.target.name?.trim() || "TARGET").slice(0, 16);
  const lambdaMin = Math.min(...data.wavelengthsM);
  const lambdaMax = Math.max(...data.wavelengthsM);

  let baseMin = Number.POSITIVE_INFINITY;
  let baseMax = 0;
  for (let i = 0; i < data.uM.length; i++) {
    const b = Math.hypot(data.uM[i], data.vM[i]);
    baseMin = Math.min(baseMin, b);
    baseMax = Math.max(baseMax, b);
  }

  const primary: FitsCard[] = [
    { key: "ORIGIN", value: "Fringe Docket", comment: "institution responsible for the file" },
    { key: "DATE", value: writtenUtc.replace(/Z$/, ""), comment: "UTC date the file was written" },
    { key: "DATE-OBS", value: dateObs, comment: "UTC start of the (simulated) observations" },
    { key: "CONTENT", value: "OIFITS2", comment: "OIFITS version 2" },
    { key: "TELESCOP", value: arrayName, comment: "array" },
    { key: "INSTRUME", value: instrumentName, comment: "instrument" },
    { key: "OBSERVER", value: "SIMULATION", comment: "simulated data, not an observation" },
    { key: "OBJECT", value: targetName, comment: "target" },
    { key: "INSMODE", value: "SIMULATED", comment: "instrument mode" },
    { key: "RA", value: real(request.target.raDeg), comment: "[deg] J2000" },
    { key: "DEC", value: real(request.target.decDeg), comment: "[deg] J2000" },
    { key: "EQUINOX", value: real(2000), comment: "[yr]" },
  ];
  if (nQ > 0) {
    primary.push(
      { key: "MJD-OBS", value: real(Math.min(...mjd)), comment: "start of observations" },
      { key: "MJD-END", value: real(Math.max(...mjd) + data.intTimeS / 86400), comment: "end of observations" },
      { key: "BASE_MIN", value: real(baseMin), comment: "[m] shortest projected baseline" },
      { key: "BASE_MAX", value: real(baseMax), comment: "[m] longest projected baseline" },
    );
  }
  primary.push(
    { key: "WAVELMIN", value: real(lambdaMin * 1e9), comment: "[nm]" },
    { key: "WAVELMAX", value: real(lambdaMax * 1e9), comment: "[nm]" },
    { key: "NUM_CHAN", value: int(nC), comment: "spectral channels" },
    { key: "COMMENT", comment: "Simulated by Fringe Docket: model V2 and closure phases plus Gaussian noise," },
    {
      key: "COMMENT",
      comment: `sigma(V2) = ${data.noise.vis2Relative} * max(V2, 0.01), sigma(CP) = ${data.noise.closurePhaseDeg} deg, seed ${data.noise.seed}.`,
    },
  );
  if (data.nominalTimes) {
    primary.push({ key: "COMMENT", comment: "No date was given (hour-angle list): instants are nominal, 2000-01-01." });
  }

  /** A one-value column of OI_TARGET that the format requires and the preview has no figure for: zero. */
  const noFigure = (name: string, code: "D" | "E", unit: string): BinaryColumn => ({
    name,
    code,
    repeat: 1,
    unit,
    values: [0],
  });

  const revn = { key: "OI_REVN", value: int(2), comment: "revision of the table definition" };
  const target = binaryTableHdu(
    "OI_TARGET",
    1,
    [
      { name: "TARGET_ID", code: "I", repeat: 1, values: [1] },
      { name: "TARGET", code: "A", repeat: 16, values: [targetName] },
      { name: "RAEP0", code: "D", repeat: 1, unit: "deg", values: [request.target.raDeg] },
      { name: "DECEP0", code: "D", repeat: 1, unit: "deg", values: [request.target.decDeg] },
      { name: "EQUINOX", code: "E", repeat: 1, unit: "yr", values: [2000] },
      noFigure("RA_ERR", "D", "deg"),
      noFigure("DEC_ERR", "D", "deg"),
      noFigure("SYSVEL", "D", "m/s"),
      { name: "VELTYP", code: "A", repeat: 8, values: ["UNKNOWN"] },
      { name: "VELDEF", code: "A", repeat: 8, values: ["OPTICAL"] },
      noFigure("PMRA", "D", "deg/yr"),
      noFigure("PMDEC", "D", "deg/yr"),
      noFigure("PMRA_ERR", "D", "deg/yr"),
      noFigure("PMDEC_ERR", "D", "deg/yr"),
      noFigure("PARALLAX", "E", "deg"),
      noFigure("PARA_ERR", "E", "deg"),
      { name: "SPECTYP", code: "A", repeat: 16, values: ["UNKNOWN"] },
      { name: "CATEGORY", code: "A", repeat: 3, values: ["SCI"] },
    ],
    [revn],
  );

  const latRad = request.site.latitudeDeg * DEG_TO_RAD;
  const lonRad = request.site.longitudeDeg * DEG_TO_RAD;
  const centre = geodeticToEcef(latRad, lonRad, request.site.altitudeM);
  const stations = request.stations;
  const staxyz: number[] = [];
  for (const s of stations) staxyz.push(...enuToEcefOffset(s.eastM, s.northM, s.upM, latRad, lonRad));
  const fovArcsec = ((lambdaMax / telescopeDiameterM) * RAD_TO_MAS) / 1000;
  const array = binaryTableHdu(
    "OI_ARRAY",
    stations.length,
    [
      { name: "TEL_NAME", code: "A", repeat: 16, values: stations.map((s) => s.name) },
      { name: "STA_NAME", code: "A", repeat: 16, values: stations.map((s) => s.name) },
      { name: "STA_INDEX", code: "I", repeat: 1, values: stations.map((_, i) => i + 1) },
      { name: "DIAMETER", code: "E", repeat: 1, unit: "m", values: stations.map(() => telescopeDiameterM) },
      { name: "STAXYZ", code: "D", repeat: 3, unit: "m", values: staxyz },
      { name: "FOV", code: "D", repeat: 1, unit: "arcsec", values: stations.map(() => fovArcsec) },
      { name: "FOVTYPE", code: "A", repeat: 6, values: stations.map(() => "FWHM") },
    ],
    [
      revn,
      { key: "ARRNAME", value: arrayName, comment: "array name, for cross-referencing" },
      { key: "FRAME", value: "GEOCENTRIC", comment: "coordinate frame" },
      { key: "ARRAYX", value: real(centre[0]), comment: "[m] array centre, WGS 84" },
      { key: "ARRAYY", value: real(centre[1]), comment: "[m] array centre, WGS 84" },
      { key: "ARRAYZ", value: real(centre[2]), comment: "[m] array centre, WGS 84" },
    ],
  );

  const lambda = data.wavelengthsM;
  const band = lambda.map((_, c) => {
    if (nC === 1) return 0;
    const lo = lambda[Math.max(0, c - 1)];
    const hi = lambda[Math.min(nC - 1, c + 1)];
    return Math.abs(hi - lo) / (c === 0 || c === nC - 1 ? 1 : 2);
  });
  const wavelength = binaryTableHdu(
    "OI_WAVELENGTH",
    nC,
    [
      { name: "EFF_WAVE", code: "E", repeat: 1, unit: "m", values: lambda },
      { name: "EFF_BAND", code: "E", repeat: 1, unit: "m", values: band },
    ],
    [revn, { key: "INSNAME", value: instrumentName, comment: "instrument name, for cross-referencing" }],
  );

  const dataCards: FitsCard[] = [
    revn,
    { key: "DATE-OBS", value: dateObs, comment: "UTC start of observations" },
    { key: "ARRNAME", value: arrayName, comment: "corresponding OI_ARRAY" },
    { key: "INSNAME", value: instrumentName, comment: "corresponding OI_WAVELENGTH" },
  ];
  const common = (rows: number, sampleOf: (r: number) => number): BinaryColumn[] => [
    { name: "TARGET_ID", code: "I", repeat: 1, values: new Array(rows).fill(1) },
    { name: "TIME", code: "D", repeat: 1, unit: "s", values: new Float64Array(rows) },
    {
      name: "MJD",
      code: "D",
      repeat: 1,
      unit: "day",
      values: Array.from({ length: rows }, (_, r) => mjd[sampleOf(r)]),
    },
    { name: "INT_TIME", code: "D", repeat: 1, unit: "s", values: new Float64Array(rows).fill(data.intTimeS) },
  ];

  const vRows = nB * nQ;
  const vis2 = binaryTableHdu(
    "OI_VIS2",
    vRows,
    [
      ...common(vRows, (r) => r % nQ),
      { name: "VIS2DATA", code: "D", repeat: nC, values: data.vis2 },
      { name: "VIS2ERR", code: "D", repeat: nC, values: data.vis2Err },
      { name: "UCOORD", code: "D", repeat: 1, unit: "m", values: data.uM },
      { name: "VCOORD", code: "D", repeat: 1, unit: "m", values: data.vM },
      {
        name: "STA_INDEX",
        code: "I",
        repeat: 2,
        values: Array.from({ length: vRows * 2 }, (_, i) => {
          const b = Math.floor(i / 2 / nQ);
          return (i % 2 === 0 ? data.baselineFirst[b] : data.baselineSecond[b]) + 1;
        }),
      },
      { name: "FLAG", code: "L", repeat: nC, values: new Array<boolean>(vRows * nC).fill(false) },
    ],
    dataCards,
  );

  const tRows = nT * nQ;
  const at = (src: Float64Array, baseline: Int32Array) =>
    Float64Array.from({ length: tRows }, (_, r) => src[baseline[Math.floor(r / nQ)] * nQ + (r % nQ)]);
  const t3 = binaryTableHdu(
    "OI_T3",
    tRows,
    [
      ...common(tRows, (r) => r % nQ),
      { name: "T3AMP", code: "D", repeat: nC, values: new Float64Array(tRows * nC).fill(Number.NaN) },
      { name: "T3AMPERR", code: "D", repeat: nC, values: new Float64Array(tRows * nC).fill(Number.NaN) },
      { name: "T3PHI", code: "D", repeat: nC, unit: "deg", values: data.closurePhaseRad.map((x) => x * RAD_TO_DEG) },
      {
        name: "T3PHIERR",
        code: "D",
        repeat: nC,
        unit: "deg",
        values: data.closurePhaseErrRad.map((x) => x * RAD_TO_DEG),
      },
      { name: "U1COORD", code: "D", repeat: 1, unit: "m", values: at(data.uM, data.triAB) },
      { name: "V1COORD", code: "D", repeat: 1, unit: "m", values: at(data.vM, data.triAB) },
      { name: "U2COORD", code: "D", repeat: 1, unit: "m", values: at(data.uM, data.triBC) },
      { name: "V2COORD", code: "D", repeat: 1, unit: "m", values: at(data.vM, data.triBC) },
      {
        name: "STA_INDEX",
        code: "I",
        repeat: 3,
        values: Array.from({ length: tRows * 3 }, (_, i) => {
          const t = Math.floor(i / 3 / nQ);
          const which = i % 3;
          return (which === 0 ? data.triA[t] : which === 1 ? data.triB[t] : data.triC[t]) + 1;
        }),
      },
      { name: "FLAG", code: "L", repeat: nC, values: new Array<boolean>(tRows * nC).fill(false) },
    ],
    dataCards,
  );

  return concatBytes([primaryHdu(primary), target, array, wavelength, vis2, t3]);
}
