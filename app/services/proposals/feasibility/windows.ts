/**
 * Time-critical windows: for each window of a target, the hours it is observable inside the window,
 * counted on the nights that can overlap it (every one, or an even sample of them for a long window).
 */
import { observingPeriodMs } from "../period";
import { lineOf } from "./lines";
import { addDays, type CellSubject, daysBetween, observeNight, spreadNights } from "./nights";
import { FEASIBILITY_THRESHOLDS, type FeasibilityLine } from "./types";

/** Julian day → Unix milliseconds. */
const jdToMs = (jd: number) => Math.round((jd - 2440587.5) * 86_400_000);

/** One line per time window of the subject's target. */
export function windowLines(subject: CellSubject): FeasibilityLine[] {
  const { cycle } = subject.input;
  const most = FEASIBILITY_THRESHOLDS.maxWindowNights;
  // The last night of the period ends on the morning after observingEnd.
  const { startMs: periodStartMs, endMs: periodEndMs } = observingPeriodMs(cycle);
  return subject.target.timeWindows.map((w, idx) => {
    const line = lineOf("windows", `Time window ${idx + 1}`);
    const startMs = Date.parse(w.startUtc);
    const endMs = Date.parse(w.endUtc);
    const span = `${w.startUtc.slice(0, 16).replace("T", " ")} – ${w.endUtc.slice(0, 16).replace("T", " ")} UTC`;
    if (!(endMs > startMs)) return line("fail", `The window ${span} ends before it starts.`);
    if (endMs <= periodStartMs || startMs >= periodEndMs) {
      return line(
        "fail",
        `The window ${span} lies outside the observing period ${cycle.observingStart} to ${cycle.observingEnd}.`,
      );
    }
    // Nights that can overlap the window: from the evening before its start to its end date.
    const first = new Date(Math.max(startMs, periodStartMs) - 86_400_000).toISOString().slice(0, 10);
    const last = new Date(Math.min(endMs, periodEndMs)).toISOString().slice(0, 10);
    const count = Math.max(1, daysBetween(first, last) + 1);
    let hours = 0;
    for (const date of spreadNights(first, count, most)) {
      if (date < addDays(cycle.observingStart, -1) || date > cycle.observingEnd) continue;
      const night = observeNight(subject, date);
      for (const jd of night.observableJd) {
        const ms = jdToMs(jd);
        if (ms >= startMs && ms <= endMs) hours += night.sampleDurationH;
      }
    }
    const sampled = count > most ? ` (${most} of its ${count} nights sampled)` : "";
    return hours === 0
      ? line("fail", `The target is never observable inside ${span}${sampled}.`)
      : line("pass", `${hours.toFixed(2)} h observable inside ${span}${sampled}.`);
  });
}
