/**
 * The committee's field rules, written once (valibot) and composed into its forms: the review, a
 * declared conflict, a declined assignment, the triage line, grades and decisions. Messages name the
 * field. Pure, safe in the browser.
 */
import * as v from "valibot";
import { type FieldErrors, fieldErrors } from "~/lib/form-errors";
import { labelledText } from "~/lib/text-fields";
import { onScale, type Scale, scaleText } from "./scale";

export const COMMENT_MAX_CHARS = 5000;
export const REASON_MAX_CHARS = 500;
export const MESSAGE_MAX_CHARS = 2000;

/** A reason someone gives (a conflict, a declined assignment): a few words at least. */
export const Reason = (label: string) =>
  v.pipe(
    v.string(),
    v.trim(),
    v.minLength(3, `${label}: say in a few words why`),
    v.maxLength(REASON_MAX_CHARS, `${label}: at most ${REASON_MAX_CHARS} characters`),
  );

/** A whole number from a form ("0", "12"), `min` … `max`. */
export const WholeNumber = (label: string, min: number, max: number) =>
  v.pipe(
    v.string(),
    v.trim(),
    v.regex(/^\d{1,9}$/, `${label}: a whole number`),
    v.transform(Number),
    v.minValue(min, `${label}: at least ${min}`),
    v.maxValue(max, `${label}: at most ${max}`),
  );

/** A number on the cycle's scale, or empty for none (a draft, no grade yet). */
export const ScaleScore = (label: string, scale: Scale) =>
  v.pipe(
    v.string(),
    v.trim(),
    v.transform((s) => (s === "" ? null : Number(s))),
    v.check((n) => n === null || onScale(n, scale), `${label}: a number on the cycle's scale, ${scaleText(scale)}`),
  );

export const CONFIDENCE_WORDS = { low: "Low", medium: "Medium", high: "High" } as const;

export const ReviewFormSchema = (scale: Scale) =>
  v.object({
    score: ScaleScore("Score", scale),
    commentToPi: labelledText("Comment to the PI", COMMENT_MAX_CHARS),
    commentToCommittee: labelledText("Comment to the committee", COMMENT_MAX_CHARS),
    confidence: v.picklist(["", "low", "medium", "high"], "Confidence: choose low, medium or high"),
    version: WholeNumber("Version", 0, 1_000_000),
  });

export type ReviewFormValues = {
  score: string;
  commentToPi: string;
  commentToCommittee: string;
  confidence: string;
  version: string;
};

export type ReviewFields = {
  score: number | null;
  commentToPi: string;
  commentToCommittee: string;
  confidence: "low" | "medium" | "high" | null;
};

/**
 * Checks a review form. A draft may be incomplete; a submission needs the score, the confidence and
 * a comment to the PI.
 */
export function parseReviewForm(
  values: ReviewFormValues,
  scale: Scale,
  submit: boolean,
): { ok: true; value: ReviewFields & { version: number } } | { ok: false; errors: FieldErrors } {
  const parsed = v.safeParse(ReviewFormSchema(scale), values);
  if (!parsed.success) return { ok: false, errors: fieldErrors(parsed.issues, { depth: 1 }) };
  const out = parsed.output;
  const value = { ...out, confidence: out.confidence === "" ? null : out.confidence };
  if (submit) {
    const errors: FieldErrors = {};
    if (value.score === null) errors.score = `Score: give a score to submit (${scaleText(scale)})`;
    if (value.confidence === null) errors.confidence = "Confidence: say how confident you are to submit";
    if (value.commentToPi === "") errors.commentToPi = "Comment to the PI: the team should hear why; write a few lines";
    if (Object.keys(errors).length) return { ok: false, errors };
  }
  return { ok: true, value };
}

/** Reads the named fields of a form as strings ("" when missing). */
export function formStrings<K extends string>(
  form: { get(name: string): unknown },
  keys: readonly K[],
): Record<K, string> {
  const out = {} as Record<K, string>;
  for (const k of keys) {
    const x = form.get(k);
    out[k] = typeof x === "string" ? x : "";
  }
  return out;
}

export const REVIEW_KEYS = ["score", "commentToPi", "commentToCommittee", "confidence", "version"] as const;

export const ConflictFormSchema = v.object({
  proposalId: WholeNumber("Proposal", 1, 2_147_483_647),
  reason: Reason("Reason"),
});

export const DeclineFormSchema = v.object({ reason: Reason("Reason for declining") });

/** The triage line: after which position of the board (empty = no line), and the disagreement threshold. */
export const BoardSettingsSchema = v.object({
  triageAfter: v.pipe(
    v.string(),
    v.trim(),
    v.check((s) => s === "" || /^\d{1,6}$/.test(s), "Triage line: a position on the board, or empty for none"),
    v.transform((s) => (s === "" ? null : Number(s))),
  ),
  disagreementSpread: v.pipe(
    v.string(),
    v.trim(),
    v.transform(Number),
    v.check((n) => Number.isFinite(n) && n >= 0 && n <= 100, "Disagreement: a spread from 0 to 100 score units"),
  ),
});

/** Hours a chair grants on one configuration: empty for none, else 0 … 10 000. */
export const GrantedHours = (label: string) =>
  v.pipe(
    v.string(),
    v.trim(),
    v.transform((s) => (s === "" ? 0 : Number(s))),
    v.check((n) => Number.isFinite(n) && n >= 0 && n <= 10_000, `${label}: hours from 0 to 10 000`),
  );

export const DecisionKind = v.picklist(["", "accept", "waitlist", "decline"], "Decision: accept, waitlist or decline");

export const Message = labelledText("Message", MESSAGE_MAX_CHARS);
