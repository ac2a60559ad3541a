/**
 * The Ranking board page's data: the computed board (board.server.ts) with what the chair may do in
 * the cycle's state, and the list of cycles that have a board.
 */
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { cycles, proposals } from "~/db/schema/proposals";
import { formatUtc } from "~/lib/format";
import { BOARD_STATUSES, loadBoard } from "./board.server";
import { scaleSteps } from "./scale";

/** Every cycle with the number of proposals the committee weighs, latest observing period first. */
export async function boardCycles(db: DbOrTx) {
  const rows = await db
    .select({
      id: cycles.id,
      name: cycles.name,
      state: cycles.state,
      observingStart: cycles.observingStart,
      observingEnd: cycles.observingEnd,
      reviewDeadline: cycles.reviewDeadline,
      decisionDate: cycles.decisionDate,
      proposals: sql<number>`count(${proposals.id})::int`,
    })
    .from(cycles)
    .leftJoin(proposals, and(eq(proposals.cycleId, cycles.id), inArray(proposals.status, BOARD_STATUSES)))
    .groupBy(cycles.id)
    .orderBy(desc(cycles.observingStart));
  return rows.map((r) => ({ ...r, reviewDeadline: r.reviewDeadline ? formatUtc(r.reviewDeadline) : null }));
}

export async function boardPage(db: DbOrTx, { cycleId }: { cycleId: number }) {
  const board = await loadBoard(db, { cycleId });
  if (!board) return null;
  const [cycle] = await db.select().from(cycles).where(eq(cycles.id, cycleId));
  const state = board.cycle.state;
  const undecided = board.rows.filter((r) => r.status === "under_review" && !r.decision.decision).length;
  return {
    cycle: {
      ...board.cycle,
      reviewDeadline: cycle.reviewDeadline ? formatUtc(cycle.reviewDeadline) : null,
      decisionDate: cycle.decisionDate,
      scaleText: board.scaleText,
      steps: scaleSteps(board.cycle.scale),
    },
    settings: board.settings,
    rows: board.rows,
    calibration: board.calibration,
    pressure: board.pressure,
    abilities: {
      settings: state === "reviewing" || state === "deciding",
      decide: state === "deciding",
      release: state === "deciding" && undecided === 0 && board.rows.some((r) => r.status === "under_review"),
    },
    undecided,
  };
}

export type BoardPageData = NonNullable<Awaited<ReturnType<typeof boardPage>>>;
