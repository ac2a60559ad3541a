/**
 * The Ranking board as data for the API and as CSV (pure): one row per proposal in the board's order,
 * units in the column names, reviewers as R1, R2, … (their names are listed apart, for the chair).
 */
import { toCsv } from "~/lib/csv";
import type { Board } from "./board";

const round = (x: number | null, d = 4) => (x === null ? null : Math.round(x * 10 ** d) / 10 ** d);

/** The board as the API gives it (GET /api/cycles/:id/board?format=json). */
export function boardJson(board: Board) {
  const configs = board.pressure.configurations;
  return {
    cycle: { ...board.cycle },
    scale: board.scaleText,
    triageAfter: board.settings.triageAfter,
    disagreementSpread: board.settings.disagreementSpread,
    reviewers: board.calibration.reviewers.map((r) => ({
      label: r.label,
      name: r.name,
      reviews: r.reviews,
      meanScore: r.meanScore,
      sdScore: r.sdScore,
    })),
    committee: board.calibration.committee,
    proposals: board.rows.map((r) => ({
      position: r.position,
      proposalId: r.proposalId,
      title: r.title,
      pi: r.pi,
      category: r.category,
      status: r.status,
      configurations: r.configurations,
      hoursRequested: r.hoursRequested,
      scores: r.scores.map((s) => ({ reviewer: s.label, score: s.score })),
      meanScore: r.meanScore,
      spread: r.spread,
      normalizedScore: r.normalizedScore,
      rank: r.rank,
      disagreement: r.disagreement,
      finalGrade: r.finalGrade,
      belowTriage: r.belowTriage,
      suggestion: {
        decision: r.suggestion.decision,
        reason: r.suggestion.reason,
        hours: byName(r.suggestion.hoursByConfig, configs),
      },
      decision: r.decision.decision,
      allocatedHours: byName(r.decision.hoursByConfig, configs),
      released: r.releasedAt !== null,
    })),
    demand: configs.map((c) => ({
      configuration: c.name,
      nights: c.nights,
      darkHoursPerNight: c.darkHoursPerNight,
      availableHours: c.capacityTotalH,
      requestedHours: c.requestedTotalH,
      unplaceableHours: c.unplaceableH,
      oversubscription: round(c.oversubscription),
      suggestedHours: c.suggestedTotalH,
    })),
    lstPressure: {
      binWidthH: board.pressure.binWidthH,
      configurations: configs.map((c) => ({
        configuration: c.name,
        capacityHours: c.capacity,
        requestedHours: c.requested,
        suggestedHours: c.suggested,
      })),
    },
  };
}

function byName(hours: Record<number, number>, configs: Board["pressure"]["configurations"]) {
  const out: Record<string, number> = {};
  for (const c of configs) if (hours[c.configurationId]) out[c.name] = hours[c.configurationId];
  return out;
}

/** The board as CSV text, one row per proposal, units in the header. */
export function boardCsv(board: Board): string {
  const configs = board.pressure.configurations;
  const scale = board.scaleText;
  const header = [
    "Position",
    "Proposal id",
    "Title",
    "PI",
    "Category",
    "Configurations",
    "Hours requested (h)",
    `Scores (${scale})`,
    `Mean score (${scale})`,
    "Spread (score units, population SD)",
    `Normalized score (z, ${board.cycle.scale.best < board.cycle.scale.worst ? "lower" : "higher"} is better)`,
    "Rank",
    "Disagreement",
    `Final grade (${scale})`,
    "Below triage line",
    "Suggestion",
    ...configs.map((c) => `Suggested ${c.name} (h)`),
    "Decision",
    ...configs.map((c) => `Allocated ${c.name} (h)`),
  ];
  const rows = board.rows.map((r) => [
    r.position,
    r.proposalId,
    r.title,
    r.pi,
    r.category,
    r.configurations.join(" "),
    r.hoursRequested,
    r.scores.map((s) => `${s.label}=${s.score}`).join(" "),
    round(r.meanScore),
    round(r.spread),
    round(r.normalizedScore),
    r.rank,
    r.disagreement ? "yes" : "no",
    r.finalGrade,
    r.belowTriage ? "yes" : "no",
    `${r.suggestion.decision}: ${r.suggestion.reason}`,
    ...configs.map((c) => round(r.suggestion.hoursByConfig[c.configurationId] ?? 0, 2)),
    r.decision.decision ?? "",
    ...configs.map((c) => r.decision.hoursByConfig[c.configurationId] ?? 0),
  ]);
  return toCsv(header, rows);
}
