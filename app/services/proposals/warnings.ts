/**
 * Submitting with failing feasibility lines: which lines fail, and the proposer's acknowledgement that
 * is frozen with the version ("submit anyway"). Pure: safe in the browser.
 */
import { formatUtc, plural } from "~/lib/format";
import type { FeasibilityReport } from "./feasibility";

/** One failing line of the report, named by where it is ("Vela 3 with compact-3", "The proposal"). */
export type FailingLine = { where: string; label: string; reason: string };

/** What the version records when it was submitted with failing lines. */
export type FeasibilityAcknowledgement = {
  failingLines: number;
  lines: string[];
  byId: number;
  byName: string;
  /** ISO instant (UTC). */
  at: string;
};

/** Every line of the report whose verdict is "fail", the proposal's own problems first. */
export function failingLines(report: FeasibilityReport): FailingLine[] {
  const out: FailingLine[] = [];
  for (const l of report.problems) if (l.verdict === "fail") out.push({ where: "The proposal", ...pick(l) });
  for (const cell of report.cells) {
    for (const l of cell.lines)
      if (l.verdict === "fail") out.push({ where: `${cell.target} with ${cell.configuration}`, ...pick(l) });
  }
  return out;
}

const pick = (l: { label: string; reason: string }) => ({ label: l.label, reason: l.reason });

/** "Vela 3 with compact-3 — Magnitude: …", one failing line as a sentence. */
export const failingLineText = (l: FailingLine) => `${l.where} — ${l.label}: ${l.reason}`;

/** "Submitted with 2 feasibility warnings acknowledged by Inés Arroyo-Vidal, 2027-01-15 12:00 UTC." */
export function acknowledgementText(a: Pick<FeasibilityAcknowledgement, "failingLines" | "byName" | "at">): string {
  return `Submitted with ${plural(a.failingLines, "feasibility warning")} acknowledged by ${a.byName}, ${formatUtc(new Date(a.at))}.`;
}
