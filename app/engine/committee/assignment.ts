/**
 * Automatic assignment of reviewers to proposals.
 *
 * Goals, in priority order:
 *  1. never a conflicted reviewer (see conflicts.ts), never the same reviewer twice on a proposal, and
 *     every kept assignment kept (a kept assignment that has become conflicted stays, with a warning);
 *  2. as many of the N reviewers per proposal as the conflicts allow;
 *  3. balanced load: the final loads ℓ_r (kept + new) minimize Σ ℓ_r²;
 *  4. science categories spread: the per-reviewer, per-category counts ℓ_rc minimize Σ ℓ_rc².
 *
 * Method: one minimum-cost flow (min-cost-flow.ts) on source → proposal (capacity: reviewers still
 * needed) → (reviewer, category of the proposal) (one unit per eligible pair) → reviewer → sink. The
 * (reviewer, category) → reviewer arcs cost 2ℓ_rc + 1 for the next unit and the reviewer → sink arcs
 * M·(2ℓ_r + 1) — the marginal costs of the squares — with M = T² + 1, T the total number of
 * assignments: two load vectors of equal total differ in Σℓ² by an even number (x² ≡ x mod 2), i.e.
 * by at least 2M, more than any difference of the category term (≤ T²), so goal 3 always wins over 4.
 * A minimum-cost maximum flow fills goal 2 first.
 *
 * Why Σℓ² balances: the load vectors reachable by maximum flows are the integer points of the base of a
 * polymatroid (shifted by the kept loads), and on such a set a point of least Σℓ² also has the least
 * largest load and the greatest smallest load (lexicographically optimal bases: Fujishige, Math. Oper.
 * Res. 5 (1980) 186–196, from memory). Hence max − min ≤ 1 whenever any assignment filling goal 2
 * allows it; the tests check this against a brute force on small committees.
 *
 * Deterministic: proposals and reviewers are processed in id order, so the result does not depend on
 * the order of the input lists.
 */
import { type Conflict, findConflicts } from "./conflicts";
import type { AssignmentInput } from "./inputs";
import { ConvexFlowNetwork } from "./min-cost-flow";
import { compareIds } from "./rank";

export const DEFAULT_REVIEWERS_PER_PROPOSAL = 3;

export interface ReviewerAssignment {
  reviewer: string;
  proposal: string;
  /** True for an assignment given in `keep`. */
  kept: boolean;
}

export interface ReviewerLoad {
  reviewer: string;
  /** Assignments after the run, kept ones included. */
  total: number;
  kept: number;
  /** Per category, categories in id order; only those with at least one assignment. */
  byCategory: { category: string; count: number }[];
}

export interface AssignmentShortfall {
  proposal: string;
  assigned: number;
  needed: number;
  reason: string;
}

export interface AssignmentResult {
  reviewersPerProposal: number;
  /** By proposal id, then reviewer id. */
  assignments: ReviewerAssignment[];
  /** By reviewer id, every committee member. */
  loads: ReviewerLoad[];
  /** Proposals with fewer than N reviewers, by proposal id. */
  shortfalls: AssignmentShortfall[];
  /** Every conflicted pair found (automatic and declared). */
  conflicts: Conflict[];
  /** Kept assignments that are conflicted, repeated or name an unknown proposal or reviewer. */
  warnings: string[];
}

function checkIds(list: readonly { id: string }[], what: string): void {
  const seen = new Set<string>();
  list.forEach((x, i) => {
    if (seen.has(x.id)) throw new RangeError(`${what}[${i}].id: repeats "${x.id}"`);
    seen.add(x.id);
  });
}

/** Assigns reviewers to proposals (see the goals above). */
export function autoAssign(input: AssignmentInput): AssignmentResult {
  const n = input.reviewersPerProposal ?? DEFAULT_REVIEWERS_PER_PROPOSAL;
  if (!Number.isInteger(n) || n < 1) throw new RangeError("reviewersPerProposal: must be a whole number ≥ 1");
  checkIds(input.proposals, "proposals");
  checkIds(input.reviewers, "reviewers");
  const proposals = [...input.proposals].sort((a, b) => compareIds(a.id, b.id));
  const reviewers = [...input.reviewers].sort((a, b) => compareIds(a.id, b.id));
  const pIndex = new Map(proposals.map((p, i) => [p.id, i]));
  const rIndex = new Map(reviewers.map((r, i) => [r.id, i]));
  const nP = proposals.length;
  const nR = reviewers.length;
  const categories = [...new Set(proposals.map((p) => p.category))].sort(compareIds);
  const cIndex = new Map(categories.map((c, i) => [c, i]));
  const nC = categories.length;
  const catOf = proposals.map((p) => cIndex.get(p.category)!);

  const conflicts = findConflicts(proposals, reviewers, input.conflicts);
  const conflicted = new Map<number, Conflict>();
  for (const c of conflicts) conflicted.set(pIndex.get(c.proposal)! * nR + rIndex.get(c.reviewer)!, c);

  // Kept assignments.
  const warnings: string[] = [];
  const kept = new Uint8Array(nP * nR);
  input.keep.forEach((k, i) => {
    const p = pIndex.get(k.proposal);
    const r = rIndex.get(k.reviewer);
    if (p === undefined || r === undefined) {
      warnings.push(
        `keep[${i}]: ${p === undefined ? `unknown proposal "${k.proposal}"` : `unknown reviewer "${k.reviewer}"`}; ignored`,
      );
      return;
    }
    if (kept[p * nR + r]) {
      warnings.push(`keep[${i}]: repeats the assignment of "${k.reviewer}" to "${k.proposal}"; counted once`);
      return;
    }
    kept[p * nR + r] = 1;
    const c = conflicted.get(p * nR + r);
    if (c)
      warnings.push(
        `keep[${i}]: "${k.reviewer}" is conflicted on "${k.proposal}" (${c.kinds.join(", ")}) but the assignment is kept`,
      );
  });
  const keptPerProposal = new Int32Array(nP);
  const keptLoad = new Int32Array(nR);
  const keptCat = new Int32Array(nR * nC);
  for (let p = 0; p < nP; p++)
    for (let r = 0; r < nR; r++)
      if (kept[p * nR + r]) {
        keptPerProposal[p]++;
        keptLoad[r]++;
        keptCat[r * nC + catOf[p]]++;
      }
  const need = Array.from(keptPerProposal, (k) => Math.max(0, n - k));
  let total = 0;
  for (let p = 0; p < nP; p++) total += keptPerProposal[p] + need[p];
  const bigM = total * total + 1;

  // Network: 0 source, 1..nP proposals, then (reviewer, category) nodes, then reviewers, then the sink.
  const rcNode = (r: number, c: number) => 1 + nP + r * nC + c;
  const rNode = (r: number) => 1 + nP + nR * nC + r;
  const sink = 1 + nP + nR * nC + nR;
  const net = new ConvexFlowNetwork(sink + 1);
  const pairArcs: { p: number; r: number; arc: number }[] = [];
  for (let p = 0; p < nP; p++) {
    if (need[p] === 0) continue;
    net.addArc(0, 1 + p, need[p], 0);
    for (let r = 0; r < nR; r++) {
      if (kept[p * nR + r] || conflicted.has(p * nR + r)) continue;
      pairArcs.push({ p, r, arc: net.addArc(1 + p, rcNode(r, catOf[p]), 1, 0) });
    }
  }
  for (let r = 0; r < nR; r++) {
    for (let c = 0; c < nC; c++) net.addArc(rcNode(r, c), rNode(r), nP, 2 * keptCat[r * nC + c] + 1, 2);
    net.addArc(rNode(r), sink, nP, bigM * (2 * keptLoad[r] + 1), 2 * bigM);
  }
  net.run(0, sink);

  const chosen = new Uint8Array(nP * nR);
  for (const { p, r, arc } of pairArcs) if (net.flowOn(arc) > 0) chosen[p * nR + r] = 1;

  const assignments: ReviewerAssignment[] = [];
  const perProposal = new Int32Array(nP);
  const load = new Int32Array(nR);
  const loadCat = new Int32Array(nR * nC);
  for (let p = 0; p < nP; p++)
    for (let r = 0; r < nR; r++) {
      const k = kept[p * nR + r] === 1;
      if (!k && !chosen[p * nR + r]) continue;
      assignments.push({ reviewer: reviewers[r].id, proposal: proposals[p].id, kept: k });
      perProposal[p]++;
      load[r]++;
      loadCat[r * nC + catOf[p]]++;
    }

  const loads: ReviewerLoad[] = reviewers.map((rv, r) => ({
    reviewer: rv.id,
    total: load[r],
    kept: keptLoad[r],
    byCategory: categories.map((category, c) => ({ category, count: loadCat[r * nC + c] })).filter((x) => x.count > 0),
  }));

  const shortfalls: AssignmentShortfall[] = [];
  for (let p = 0; p < nP; p++) {
    if (perProposal[p] >= n) continue;
    const counts = { team: 0, institute: 0, declared: 0 };
    let nConflicted = 0;
    for (let r = 0; r < nR; r++) {
      const c = conflicted.get(p * nR + r);
      if (!c || kept[p * nR + r]) continue;
      nConflicted++;
      for (const kind of c.kinds) counts[kind]++;
    }
    const parts = (["team", "institute", "declared"] as const)
      .filter((k) => counts[k] > 0)
      .map((k) => `${k === "team" ? "on the team" : k === "institute" ? "same institute" : "declared"} ${counts[k]}`);
    const free = nR - nConflicted;
    shortfalls.push({
      proposal: proposals[p].id,
      assigned: perProposal[p],
      needed: n,
      reason:
        nR < n
          ? `the committee has only ${nR} member${nR === 1 ? "" : "s"}`
          : `only ${free} of ${nR} committee members are free of conflicts${parts.length ? ` (conflicted: ${parts.join(", ")})` : ""}`,
    });
  }

  return { reviewersPerProposal: n, assignments, loads, shortfalls, conflicts, warnings };
}
