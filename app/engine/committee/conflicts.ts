/**
 * Conflicts of interest between committee members and proposals.
 *
 * A reviewer is conflicted on a proposal when
 *  - "team": the reviewer is one of the proposal's team (PI or co-investigator);
 *  - "institute": the reviewer's institute is one of the team's institutes (compared trimmed and
 *    case-blind; an empty or missing institute never matches);
 *  - "declared": the reviewer declared a conflict on it.
 * A pair may be conflicted for several reasons; all are listed.
 */
import type { AssignmentProposal, AssignmentReviewer, DeclaredConflict } from "./inputs";

export type ConflictKind = "team" | "institute" | "declared";

export interface Conflict {
  reviewer: string;
  proposal: string;
  kinds: ConflictKind[];
  /** The declared reason, when a declaration gave one. */
  declaredReason: string | null;
}

const normInstitute = (s: string | null | undefined) => (s ?? "").trim().toLowerCase();

/** Every conflicted (reviewer, proposal) pair, by proposal then reviewer in the order given. */
export function findConflicts(
  proposals: readonly AssignmentProposal[],
  reviewers: readonly AssignmentReviewer[],
  declared: readonly DeclaredConflict[],
): Conflict[] {
  const declaredMap = new Map<string, string | null>();
  for (const d of declared) {
    const key = `${d.reviewer}\u0000${d.proposal}`;
    const reason = d.reason?.trim() || null;
    if (!declaredMap.has(key) || (declaredMap.get(key) === null && reason)) declaredMap.set(key, reason);
  }
  const out: Conflict[] = [];
  for (const p of proposals) {
    const team = new Set(p.team);
    const institutes = new Set(p.institutes.map(normInstitute).filter((s) => s !== ""));
    for (const r of reviewers) {
      const kinds: ConflictKind[] = [];
      if (team.has(r.id)) kinds.push("team");
      const inst = normInstitute(r.institute);
      if (inst !== "" && institutes.has(inst)) kinds.push("institute");
      const key = `${r.id}\u0000${p.id}`;
      if (declaredMap.has(key)) kinds.push("declared");
      if (kinds.length > 0)
        out.push({ reviewer: r.id, proposal: p.id, kinds, declaredReason: declaredMap.get(key) ?? null });
    }
  }
  return out;
}
