/** Proposals in words, as the pages and the notices show them (pure: safe in the browser). */
import type { ProposalStatus } from "~/db/schema/proposals";

/** Our words for each status. */
export const STATUS_WORDS: Record<ProposalStatus, string> = {
  draft: "Draft",
  submitted: "Submitted",
  under_review: "Under review",
  accepted: "Accepted",
  waitlisted: "On the waiting list",
  declined: "Not accepted",
  scheduled: "On the schedule",
  withdrawn: "Withdrawn",
};

/** Time left before a deadline in plain words: "44 days left", "5 hours left", "closed". */
export function deadlineCountdown(deadline: Date, now: Date = new Date()): string {
  const ms = deadline.getTime() - now.getTime();
  if (ms <= 0) return "closed";
  const hours = ms / 3_600_000;
  if (hours < 1) return `${Math.max(1, Math.floor(ms / 60_000))} min left`;
  if (hours < 48) return `${Math.floor(hours)} hour${Math.floor(hours) === 1 ? "" : "s"} left`;
  return `${Math.floor(hours / 24)} days left`;
}

/** "a", "a and b", "a, b and c". */
export function listWords(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

/** One line of at most n characters, for a mail subject. */
export function clip(s: string, n: number): string {
  const line = s.replace(/\s+/g, " ").trim();
  return line.length <= n ? line : `${line.slice(0, n - 1)}…`;
}

/** Magnitudes per band in a few words: "H 4.2, K 3.9", or "—" for none. */
export function describeMagnitudes(m: Record<string, number>): string {
  const parts = Object.entries(m).map(([k, v]) => `${k} ${v}`);
  return parts.length ? parts.join(", ") : "—";
}

/** Words as a reader counts them: runs of non-space characters (the abstract's limit counts these). */
export function countWords(text: string): number {
  const t = text.trim();
  return t === "" ? 0 : t.split(/\s+/).length;
}
