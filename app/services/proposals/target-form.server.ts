/**
 * The form of a proposal's target: the target's own fields (read as My targets reads them) and the
 * proposal's constraints on it: a minimum elevation, time-critical windows and calibrators, the
 * last two as repeated rows. Errors are keyed by field ("minElevationDeg", "window-1", "calibrator-0").
 */
import type { CalibratorJson, proposalTargets, TimeWindowJson } from "~/db/schema/proposals";
import { formatDeclination, formatRightAscension, parseDeclination, parseRightAscension } from "~/lib/coordinates";
import { readTargetForm, targetFormValues, valuesOfTarget } from "~/services/targets/form.server";
import { PROPOSAL_LIMITS } from "./schemas";
import type { TargetFields } from "./targets.server";

const L = PROPOSAL_LIMITS;

export type WindowRow = { start: string; end: string; note: string };
export type CalibratorRow = { name: string; ra: string; dec: string; diameter: string; magnitude: string };
export type TargetValues = Record<string, string> & { minElevationDeg?: string };

/** What the form shows: the values of the fields and the rows of windows and calibrators. */
export type TargetFormState = { values: TargetValues; windows: WindowRow[]; calibrators: CalibratorRow[] };

/** The form of a new target. */
export function blankTargetForm(): TargetFormState {
  return {
    values: { name: "", ra: "", dec: "", model: "point", notes: "", minElevationDeg: "" },
    windows: [],
    calibrators: [],
  };
}

/** A stored target as the form shows it (coordinates sexagesimal, instants as `datetime-local` values). */
export function targetFormOf(t: typeof proposalTargets.$inferSelect): TargetFormState {
  const toInput = (iso: string) => iso.slice(0, 16);
  return {
    values: { ...valuesOfTarget(t), minElevationDeg: t.minElevationDeg === null ? "" : String(t.minElevationDeg) },
    windows: t.timeWindows.map((w) => ({ start: toInput(w.startUtc), end: toInput(w.endUtc), note: w.note ?? "" })),
    calibrators: t.calibrators.map((c) => ({
      name: c.name,
      ra: formatRightAscension(c.raDeg, 2),
      dec: formatDeclination(c.decDeg, 1),
      diameter: c.diameterMas === undefined ? "" : String(c.diameterMas),
      magnitude: c.magnitude === undefined ? "" : String(c.magnitude),
    })),
  };
}

/** "2027-04-10T03:00" or "2027-04-10 03:00:00Z" (UTC) → ISO "2027-04-10T03:00:00Z"; null if unreadable. */
function readUtc(text: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?(?:\.\d+)?Z?$/i.exec(text.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s = "00"] = m;
  const ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, +s);
  const back = new Date(ms);
  if (back.getUTCMonth() !== +mo - 1 || back.getUTCDate() !== +d || +h > 23 || +mi > 59 || +s > 59) return null;
  if (+y < 2000 || +y > 2200) return null;
  return back.toISOString().replace(/\.\d{3}Z$/, "Z");
}

/** Repeated fields (`name` posted once per row) as rows; rows left wholly empty are dropped. */
function rowsOf<T extends Record<string, string>>(form: FormData, fields: Record<keyof T, string>): T[] {
  const columns = Object.entries(fields).map(
    ([key, name]) => [key, form.getAll(name as string).map((x) => (typeof x === "string" ? x : ""))] as const,
  );
  const n = Math.max(0, ...columns.map(([, list]) => list.length));
  const out: T[] = [];
  for (let i = 0; i < n; i++) {
    const row = {} as Record<string, string>;
    for (const [key, list] of columns) row[key] = list[i] ?? "";
    if (!Object.values(row).every((x) => x.trim() === "")) out.push(row as T);
  }
  return out;
}

function readMinElevation(text: string, siteMinElevationDeg: number, errors: Record<string, string>) {
  if (text.trim() === "") return null;
  const x = Number(text.trim());
  if (!Number.isFinite(x) || x < 0 || x > 90)
    errors.minElevationDeg = "Minimum elevation: a number of degrees from 0 to 90 (or empty for the array's limit).";
  else if (x < siteMinElevationDeg)
    errors.minElevationDeg = `Minimum elevation: the array does not observe below ${siteMinElevationDeg}°; leave it empty to use that limit.`;
  else return x;
  return null;
}

function readWindows(rows: WindowRow[], errors: Record<string, string>): TimeWindowJson[] {
  const out: TimeWindowJson[] = [];
  if (rows.length > L.windowsMax) errors["window-0"] = `Time windows: at most ${L.windowsMax}.`;
  rows.forEach((w, i) => {
    const label = `Time window ${i + 1}`;
    const key = `window-${i}`;
    const start = readUtc(w.start);
    const end = readUtc(w.end);
    if (!start) errors[key] ??= `${label}: the start must be a date and time (UTC), e.g. 2027-04-10 03:00.`;
    else if (!end) errors[key] ??= `${label}: the end must be a date and time (UTC), e.g. 2027-04-10 05:30.`;
    else if (Date.parse(end) <= Date.parse(start)) errors[key] ??= `${label}: the end must be after the start.`;
    else if (w.note.length > 200) errors[key] ??= `${label}: the note is longer than 200 characters.`;
    else
      out.push(
        w.note.trim() ? { startUtc: start, endUtc: end, note: w.note.trim() } : { startUtc: start, endUtc: end },
      );
  });
  return out;
}

function readCalibrators(rows: CalibratorRow[], errors: Record<string, string>): CalibratorJson[] {
  const out: CalibratorJson[] = [];
  if (rows.length > L.calibratorsMax) errors["calibrator-0"] = `Calibrators: at most ${L.calibratorsMax}.`;
  rows.forEach((c, i) => {
    const label = `Calibrator ${i + 1}`;
    const key = `calibrator-${i}`;
    const ra = parseRightAscension(c.ra);
    const dec = parseDeclination(c.dec);
    const diameter = c.diameter.trim() === "" ? undefined : Number(c.diameter);
    const magnitude = c.magnitude.trim() === "" ? undefined : Number(c.magnitude);
    if (c.name.trim() === "") errors[key] ??= `${label}: a name is required.`;
    else if (c.name.trim().length > 80) errors[key] ??= `${label}: the name is longer than 80 characters.`;
    else if (!ra.ok) errors[key] ??= `${label}: ${ra.message}.`;
    else if (!dec.ok) errors[key] ??= `${label}: ${dec.message}.`;
    else if (diameter !== undefined && !(Number.isFinite(diameter) && diameter > 0 && diameter < 1000))
      errors[key] ??= `${label}: the diameter must be a positive number of mas.`;
    else if (magnitude !== undefined && !(Number.isFinite(magnitude) && magnitude >= -30 && magnitude <= 30))
      errors[key] ??= `${label}: the magnitude must be between -30 and 30.`;
    else {
      const cal: CalibratorJson = { name: c.name.trim(), raDeg: ra.deg, decDeg: dec.deg };
      if (diameter !== undefined) cal.diameterMas = diameter;
      if (magnitude !== undefined) cal.magnitude = magnitude;
      out.push(cal);
    }
  });
  return out;
}

/**
 * Reads a posted target form: what to show again (the values and the non-empty rows), the errors by
 * field, and the target to save when there is none.
 */
export function readProposalTargetForm(
  form: FormData,
  context: { bands: string[]; siteMinElevationDeg: number },
): TargetFormState & { errors: Record<string, string>; target: TargetFields | null } {
  const values: TargetValues = {
    ...targetFormValues(form, context.bands),
    minElevationDeg: String(form.get("minElevationDeg") ?? ""),
  };
  const core = readTargetForm(values, context.bands);
  const errors: Record<string, string> = { ...core.errors };
  const minElevationDeg = readMinElevation(values.minElevationDeg ?? "", context.siteMinElevationDeg, errors);
  const windows = rowsOf<WindowRow>(form, { start: "windowStart", end: "windowEnd", note: "windowNote" });
  const calibrators = rowsOf<CalibratorRow>(form, {
    name: "calName",
    ra: "calRa",
    dec: "calDec",
    diameter: "calDiameter",
    magnitude: "calMagnitude",
  });
  const timeWindows = readWindows(windows, errors);
  const calibratorList = readCalibrators(calibrators, errors);
  const state = { values, windows, calibrators };
  if (!core.target || Object.keys(errors).length > 0) return { ...state, errors, target: null };
  const { name, raDeg, decDeg, model, magnitudes, notes } = core.target;
  return {
    ...state,
    errors,
    target: {
      name,
      raDeg,
      decDeg,
      model,
      magnitudes,
      notes,
      minElevationDeg,
      timeWindows,
      calibrators: calibratorList,
    },
  };
}
