/**
 * The chair's decisions form on the Ranking board (pure): per proposal a final grade, a decision, the
 * hours granted per requested configuration and a message to the team. Field names:
 * `grade-<proposal>`, `decision-<proposal>`, `hours-<proposal>-<configuration>`, `message-<proposal>`.
 */
import * as v from "valibot";
import type { FieldErrors } from "~/lib/form-errors";
import type { BoardDecisionKind, HoursByConfiguration } from "./board-records";
import type { Scale } from "./scale";
import { DecisionKind, GrantedHours, Message, ScaleScore } from "./schemas";

export type DecisionEntry = {
  proposalId: number;
  finalGrade: number | null;
  decision: BoardDecisionKind | null;
  hours: HoursByConfiguration;
  message: string;
};

export type DecisionSubject = {
  id: number;
  title: string;
  hours: HoursByConfiguration;
  configNames: Record<number, string>;
};

const fmt = (h: number) => (Number.isInteger(h) ? String(h) : h.toFixed(1));

/** Reads and checks one entry per proposal; errors keyed by field name. */
export function parseDecisionsForm(
  form: { get(name: string): unknown },
  subjects: readonly DecisionSubject[],
  scale: Scale,
): { ok: true; entries: DecisionEntry[] } | { ok: false; errors: FieldErrors } {
  const str = (k: string) => {
    const x = form.get(k);
    return typeof x === "string" ? x : "";
  };
  const errors: FieldErrors = {};
  const entries: DecisionEntry[] = [];
  for (const p of subjects) {
    const gradeKey = `grade-${p.id}`;
    const grade = v.safeParse(ScaleScore(`Final grade of “${p.title}”`, scale), str(gradeKey));
    if (!grade.success) errors[gradeKey] = grade.issues[0].message;
    const decisionKey = `decision-${p.id}`;
    const decision = v.safeParse(DecisionKind, str(decisionKey));
    if (!decision.success) errors[decisionKey] = `Decision of “${p.title}”: accept, waitlist or decline`;
    const messageKey = `message-${p.id}`;
    const message = v.safeParse(Message, str(messageKey));
    if (!message.success) errors[messageKey] = message.issues[0].message.replace("Message", `Message for “${p.title}”`);
    const hours: HoursByConfiguration = {};
    let total = 0;
    for (const [cid, requested] of Object.entries(p.hours)) {
      const key = `hours-${p.id}-${cid}`;
      const name = p.configNames[Number(cid)] ?? cid;
      const h = v.safeParse(GrantedHours(`Hours of “${p.title}” on ${name}`), str(key));
      if (!h.success) {
        errors[key] = h.issues[0].message;
        continue;
      }
      if (h.output > requested + 1e-9) {
        errors[key] = `Hours of “${p.title}” on ${name}: at most the ${fmt(requested)} h requested`;
        continue;
      }
      if (h.output > 0) hours[Number(cid)] = h.output;
      total += h.output;
    }
    const kind = decision.success && decision.output !== "" ? decision.output : null;
    if (kind === "accept" && total <= 0 && !Object.keys(errors).some((k) => k.startsWith(`hours-${p.id}-`)))
      errors[decisionKey] = `Decision of “${p.title}”: an accepted proposal needs hours on at least one configuration`;
    if (kind !== "accept" && total > 0)
      errors[decisionKey] = `Decision of “${p.title}”: hours are granted only to an accepted proposal`;
    entries.push({
      proposalId: p.id,
      finalGrade: grade.success ? grade.output : null,
      decision: kind,
      hours: kind === "accept" ? hours : {},
      message: message.success ? message.output : "",
    });
  }
  return Object.keys(errors).length ? { ok: false, errors } : { ok: true, entries };
}
