/**
 * The Ranking board, computed from its records (pure): every score, the `rank` computation of the
 * engine (the same as `cli rank` and POST /api/rank), the board's order (final grades first, then the
 * ranking), the triage line, reviewer calibration, and — from board-pressure.ts — demand, LST pressure
 * and the suggested allocation.
 */
import { type DarkTime, meanAndPopulationSd, type RankedProposal, rankReviews } from "~/engine";
import { type BoardPressure, boardPressure, type Suggestion } from "./board-pressure";
import type { BoardDecisionKind, BoardRecords, HoursByConfiguration } from "./board-records";
import { rankId } from "./board-records";
import { compareScores, scaleText } from "./scale";

export type BoardScore = { label: string; reviewerId: number; score: number };

export type BoardRow = {
  proposalId: number;
  title: string;
  pi: string;
  category: string;
  status: string;
  /** Configuration names, in the board's configuration order. */
  configurations: string[];
  hoursRequested: number;
  hoursByConfig: HoursByConfiguration;
  scores: BoardScore[];
  assigned: number;
  submitted: number;
  meanScore: number | null;
  spread: number | null;
  normalizedScore: number | null;
  /** From the `rank` computation; null without a submitted score. */
  rank: number | null;
  disagreement: boolean;
  finalGrade: number | null;
  /** 1-based place in the board's order. */
  position: number;
  belowTriage: boolean;
  suggestion: Suggestion;
  decision: { decision: BoardDecisionKind | null; message: string; hoursByConfig: HoursByConfiguration };
  releasedAt: string | null;
};

export type Calibration = {
  reviewers: { reviewerId: number; label: string; name: string; reviews: number; meanScore: number; sdScore: number }[];
  committee: { reviews: number; meanScore: number | null; sdScore: number };
};

export type Board = {
  cycle: BoardRecords["cycle"];
  settings: BoardRecords["settings"];
  scaleText: string;
  rows: BoardRow[];
  calibration: Calibration;
  pressure: BoardPressure;
};

/** Labels R1, R2, … by the order of `records.reviewers`. */
export function reviewerLabels(records: Pick<BoardRecords, "reviewers">): Map<number, string> {
  return new Map(records.reviewers.map((r, i) => [r.id, `R${i + 1}`]));
}

/**
 * The board's order: proposals with a final grade first (best grade first, ties by rank), then the
 * ranked ones by rank, then those without a submitted score by id.
 */
export function boardOrder(
  proposals: readonly { id: number; finalGrade: number | null; rank: number | null }[],
  scale: BoardRecords["cycle"]["scale"],
): number[] {
  const rankOf = (p: { rank: number | null }) => p.rank ?? Number.POSITIVE_INFINITY;
  return [...proposals]
    .sort((a, b) => {
      const ga = a.finalGrade !== null;
      const gb = b.finalGrade !== null;
      if (ga !== gb) return ga ? -1 : 1;
      if (ga && gb && a.finalGrade !== b.finalGrade) return compareScores(a.finalGrade!, b.finalGrade!, scale);
      const ra = rankOf(a);
      const rb = rankOf(b);
      if (ra !== rb) return ra < rb ? -1 : 1;
      return a.id - b.id;
    })
    .map((p) => p.id);
}

export function computeBoard(records: BoardRecords, darkBySite: ReadonlyMap<number, DarkTime>): Board {
  const scale = records.cycle.scale;
  const labels = reviewerLabels(records);
  const ranking = rankReviews({
    scale,
    reviews: records.reviews.map((r) => ({
      reviewer: rankId(r.reviewerId),
      proposal: rankId(r.proposalId),
      score: r.score,
    })),
  });
  const ranked = new Map<string, RankedProposal>(ranking.proposals.map((p) => [p.proposal, p]));
  const decisions = new Map(records.decisions.map((d) => [d.proposalId, d]));
  const scoresOf = new Map<number, BoardScore[]>();
  for (const r of records.reviews) {
    const list = scoresOf.get(r.proposalId) ?? [];
    list.push({ label: labels.get(r.reviewerId) ?? "R?", reviewerId: r.reviewerId, score: r.score });
    scoresOf.set(r.proposalId, list);
  }
  for (const list of scoresOf.values()) list.sort((a, b) => labelNumber(a.label) - labelNumber(b.label));

  const order = boardOrder(
    records.proposals.map((p) => ({
      id: p.id,
      finalGrade: decisions.get(p.id)?.finalGrade ?? null,
      rank: ranked.get(rankId(p.id))?.rank ?? null,
    })),
    scale,
  );
  const position = new Map(order.map((id, i) => [id, i + 1]));
  const triage = records.settings.triageAfter;
  const belowTriage = (id: number) => triage !== null && position.get(id)! > triage;
  const walkOrder = order.filter((id) => {
    if (belowTriage(id)) return false;
    return decisions.get(id)?.finalGrade != null || ranked.has(rankId(id));
  });
  const { suggestions, ...pressure } = boardPressure(records, darkBySite, walkOrder);
  const configName = new Map(records.configurations.map((c) => [c.id, c.name]));
  const configOrder = new Map(records.configurations.map((c, i) => [c.id, i]));

  const byId = new Map(records.proposals.map((p) => [p.id, p]));
  const rows = order.map((id): BoardRow => {
    const p = byId.get(id)!;
    const rk = ranked.get(rankId(id));
    const d = decisions.get(id);
    const configIds = Object.keys(p.hours)
      .map(Number)
      .sort((a, b) => (configOrder.get(a) ?? 99) - (configOrder.get(b) ?? 99));
    let suggestion = suggestions.get(id);
    if (!suggestion) {
      suggestion = belowTriage(id)
        ? { decision: "decline", hoursByConfig: {}, reason: "below the triage line: not discussed" }
        : { decision: "waitlist", hoursByConfig: {}, reason: "no submitted review yet" };
    }
    return {
      proposalId: id,
      title: p.title,
      pi: p.pi,
      category: p.category,
      status: p.status,
      configurations: configIds.map((c) => configName.get(c) ?? `#${c}`),
      hoursRequested: Object.values(p.hours).reduce((s, h) => s + h, 0),
      hoursByConfig: p.hours,
      scores: scoresOf.get(id) ?? [],
      assigned: p.assigned,
      submitted: p.submitted,
      meanScore: rk?.meanScore ?? null,
      spread: rk?.spread ?? null,
      normalizedScore: rk?.normalizedScore ?? null,
      rank: rk?.rank ?? null,
      disagreement: rk !== undefined && rk.reviews > 1 && rk.spread > records.settings.disagreementSpread,
      finalGrade: d?.finalGrade ?? null,
      position: position.get(id)!,
      belowTriage: belowTriage(id),
      suggestion,
      decision: { decision: d?.decision ?? null, message: d?.message ?? "", hoursByConfig: d?.hours ?? {} },
      releasedAt: d?.releasedAt ?? null,
    };
  });

  const names = new Map(records.reviewers.map((r) => [r.id, r.name]));
  const all = meanAndPopulationSd(records.reviews.map((r) => r.score));
  const calibration: Calibration = {
    reviewers: ranking.reviewers
      .map((c) => {
        const reviewerId = Number(c.reviewer);
        return {
          reviewerId,
          label: labels.get(reviewerId) ?? "R?",
          name: names.get(reviewerId) ?? "?",
          reviews: c.reviews,
          meanScore: c.meanScore,
          sdScore: c.sdScore,
        };
      })
      .sort((a, b) => labelNumber(a.label) - labelNumber(b.label)),
    committee: { reviews: all.n, meanScore: all.n ? all.mean : null, sdScore: all.sd },
  };
  return { cycle: records.cycle, settings: records.settings, scaleText: scaleText(scale), rows, calibration, pressure };
}

function labelNumber(label: string): number {
  const n = Number(label.slice(1));
  return Number.isFinite(n) ? n : Number.POSITIVE_INFINITY;
}
