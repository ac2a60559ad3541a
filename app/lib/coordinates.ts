/**
 * Reading and writing equatorial coordinates as people type them. Pure: no I/O, safe in the browser.
 *
 * Right ascension: sexagesimal HOURS ("05:36:12.8", "05 36 12.8", "5h36m12.8s", "05:36.2"), decimal
 * hours with an "h" ("5.6036h"), or decimal DEGREES ("84.05", "84.05°", "84.05d").
 * Declination: sexagesimal DEGREES ("-01:12:07", "−1 12 7", "-01°12′07″", "-01d12m07s") or decimal
 * degrees ("-1.2"). The sign is read from the text, so "-00:30:00" is −0.5°, not +0.5°.
 * Only the last sexagesimal part may carry decimals; minutes and seconds must be below 60.
 * Ranges: RA 0 ≤ α < 24 h (0 ≤ α < 360°); Dec −90° ≤ δ ≤ +90°.
 * Every failure is one sentence that starts with the field's name.
 */

export type AngleParse = { ok: true; deg: number } | { ok: false; message: string };

const RA = "Right ascension";
const DEC = "Declination";

/** Unicode minus signs and dashes people paste from papers and catalogues, as "-". */
function normaliseSigns(text: string): string {
  return text.replace(/[\u2212\u2012\u2013\u2014\uFE63\uFF0D]/g, "-").replace(/\uFF0B/g, "+");
}

const DECIMAL = /^\d+(?:\.\d*)?$|^\.\d+$/;

type Split =
  | { kind: "decimal"; value: number; unit: "deg" | "hour" | null }
  | { kind: "sexagesimal"; parts: number[] }
  | { kind: "unreadable" };

/** Splits unsigned text into a decimal number with an optional unit, or 2–3 sexagesimal parts. */
function split(text: string): Split {
  const t = text.trim();
  const single = /^(\d+(?:\.\d*)?|\.\d+)\s*(°|d|deg|degrees?|h|hr|hours?)?$/i.exec(t);
  if (single) {
    const unit = single[2] ? (/^h/i.test(single[2]) ? "hour" : "deg") : null;
    return { kind: "decimal", value: Number(single[1]), unit };
  }
  // Unit letters and symbols act as separators: 5h36m12.8s, 01°12′07″, 01d12m07s, 01:12:07, 01 12 07.
  const spaced = t
    .replace(/[hHdD°:∶]/g, " ")
    .replace(/[mM′'’]/g, " ")
    .replace(/[sS″"”]/g, " ")
    .trim();
  const parts = spaced.split(/\s+/);
  if (parts.length < 2 || parts.length > 3) return { kind: "unreadable" };
  for (let i = 0; i < parts.length; i++) {
    const isLast = i === parts.length - 1;
    if (isLast ? !DECIMAL.test(parts[i]) : !/^\d+$/.test(parts[i])) return { kind: "unreadable" };
  }
  return { kind: "sexagesimal", parts: parts.map(Number) };
}

function readSign(text: string): { negative: boolean; rest: string; explicit: boolean } {
  const t = normaliseSigns(text).trim();
  if (t.startsWith("-")) return { negative: true, rest: t.slice(1), explicit: true };
  if (t.startsWith("+")) return { negative: false, rest: t.slice(1), explicit: true };
  return { negative: false, rest: t, explicit: false };
}

/** Checks minutes and seconds of a sexagesimal value; returns the failure text or null. */
function checkMinutesSeconds(field: string, parts: number[]): string | null {
  const [, minutes, seconds] = parts;
  if (minutes !== undefined && !(minutes < 60)) return `${field}: minutes must be below 60 (got ${minutes})`;
  if (seconds !== undefined && !(seconds < 60)) return `${field}: seconds must be below 60 (got ${seconds})`;
  return null;
}

function sexagesimalValue(parts: number[]): number {
  const [a, b = 0, c = 0] = parts;
  return a + b / 60 + c / 3600;
}

/**
 * Reads a right ascension. Sexagesimal and "h"-suffixed values are hours; plain decimals are degrees.
 * @returns degrees in [0, 360), or a message naming the field.
 */
export function parseRightAscension(input: string): AngleParse {
  const raw = input ?? "";
  if (raw.trim() === "") return { ok: false, message: `${RA}: required (e.g. 05:36:12.8 or 84.05)` };
  const { negative, rest } = readSign(raw);
  if (negative) return { ok: false, message: `${RA}: cannot be negative (0 to 24 h, or 0 to 360°)` };
  const s = split(rest);
  if (s.kind === "unreadable") {
    return {
      ok: false,
      message: `${RA}: could not read "${raw.trim()}"; type hours as hh:mm:ss.s (e.g. 05:36:12.8) or decimal degrees (e.g. 84.05)`,
    };
  }
  if (s.kind === "decimal") {
    if (s.unit === "hour") {
      if (!(s.value < 24)) return { ok: false, message: `${RA}: must be below 24 h (got ${s.value} h)` };
      return { ok: true, deg: s.value * 15 };
    }
    if (!(s.value < 360)) return { ok: false, message: `${RA}: must be below 360° (got ${s.value}°)` };
    return { ok: true, deg: s.value };
  }
  const hours = s.parts[0];
  if (!(hours < 24)) return { ok: false, message: `${RA}: hours must be from 0 to 23 (got ${hours})` };
  const ms = checkMinutesSeconds(RA, s.parts);
  if (ms) return { ok: false, message: ms };
  const deg = sexagesimalValue(s.parts) * 15;
  if (!(deg < 360)) return { ok: false, message: `${RA}: must be below 24 h` };
  return { ok: true, deg };
}

/**
 * Reads a declination (sexagesimal or decimal degrees).
 * @returns degrees in [−90, 90], or a message naming the field.
 */
export function parseDeclination(input: string): AngleParse {
  const raw = input ?? "";
  if (raw.trim() === "") return { ok: false, message: `${DEC}: required (e.g. -01:12:07 or -1.2)` };
  const { negative, rest } = readSign(raw);
  const s = split(rest);
  if (s.kind === "unreadable" || (s.kind === "decimal" && s.unit === "hour")) {
    return {
      ok: false,
      message: `${DEC}: could not read "${raw.trim()}"; type ±dd:mm:ss (e.g. -01:12:07) or decimal degrees (e.g. -1.2)`,
    };
  }
  let deg: number;
  if (s.kind === "decimal") {
    deg = s.value;
  } else {
    const ms = checkMinutesSeconds(DEC, s.parts);
    if (ms) return { ok: false, message: ms };
    deg = sexagesimalValue(s.parts);
  }
  if (deg > 90) {
    return {
      ok: false,
      message: `${DEC}: must be between -90° and +90° (got ${negative ? "-" : ""}${round(deg, 6)}°)`,
    };
  }
  return { ok: true, deg: negative ? -deg : deg };
}

function round(x: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(x * f) / f;
}

function pad(n: number, width: number): string {
  return String(n).padStart(width, "0");
}

/** Splits a non-negative value into whole units, minutes and seconds rounded to `decimals`, carrying 60 s / 60 min. */
function sexagesimalParts(value: number, decimals: number): [number, number, string] {
  const scale = 10 ** decimals;
  let totalSeconds = Math.round(value * 3600 * scale) / scale;
  let whole = Math.floor(totalSeconds / 3600);
  totalSeconds -= whole * 3600;
  let minutes = Math.floor(totalSeconds / 60 + 1e-12);
  let seconds = totalSeconds - minutes * 60;
  if (seconds < 0) seconds = 0;
  if (round(seconds, decimals) >= 60) {
    seconds = 0;
    minutes += 1;
  }
  if (minutes >= 60) {
    minutes -= 60;
    whole += 1;
  }
  const secText = seconds.toFixed(decimals);
  const secWidth = decimals > 0 ? 3 + decimals : 2;
  return [whole, minutes, secText.padStart(secWidth, "0")];
}

/** Right ascension in degrees as "hh:mm:ss.ss" (hours wrap to 0..23). */
export function formatRightAscension(deg: number, decimals = 2): string {
  const hours = (((deg / 15) % 24) + 24) % 24;
  const [h, m, s] = sexagesimalParts(hours, decimals);
  return `${pad(h % 24, 2)}:${pad(m, 2)}:${s}`;
}

/** Declination in degrees as "±dd:mm:ss.s". */
export function formatDeclination(deg: number, decimals = 1): string {
  const sign = deg < 0 ? "-" : "+";
  const [d, m, s] = sexagesimalParts(Math.abs(deg), decimals);
  return `${sign}${pad(d, 2)}:${pad(m, 2)}:${s}`;
}
