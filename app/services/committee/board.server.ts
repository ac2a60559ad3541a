/**
 * The Ranking board's reads: the records of a cycle (board-records.ts) in a few queries, the cycle's
 * darkness from its store, and the computed board. The page, the API (GET /api/cycles/:id/board) and
 * the benchmark all go through `loadBoard`.
 */
import { and, asc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { configurationStations, stations } from "~/db/schema/array";
import {
  allocatedHours,
  committeeBoards,
  committeeMembers,
  proposalDecisions,
  reviewAssignments,
  reviews,
} from "~/db/schema/committee";
import {
  cycles,
  PROPOSAL_STATUSES,
  type ProposalStatus,
  proposalHours,
  proposals,
  proposalTargets,
} from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { activeAssignment, submittedReview } from "~/lib/conditions.server";
import { piOfProposal, proposalOfAssignment, reviewOfAssignment } from "~/lib/joins.server";
import { offersWithSites } from "~/services/cycles/queries.server";
import { type Board, computeBoard } from "./board";
import type { BoardRecords, HoursByConfiguration } from "./board-records";
import { cycleDarkness } from "./dark-time.server";

/** Statuses of proposals the committee never weighs: not yet submitted, or taken back by the team. */
const OFF_BOARD_STATUSES: readonly ProposalStatus[] = ["draft", "withdrawn"];

/** The statuses of proposals the committee weighs (submitted, and every outcome of the review). */
export const BOARD_STATUSES: ProposalStatus[] = PROPOSAL_STATUSES.filter((s) => !OFF_BOARD_STATUSES.includes(s));

export const DEFAULT_DISAGREEMENT_SPREAD = 1;

function hoursMap(rows: { proposalId: number; configurationId: number; hours: number }[]) {
  const out = new Map<number, HoursByConfiguration>();
  for (const r of rows) {
    const m = out.get(r.proposalId) ?? {};
    m[r.configurationId] = r.hours;
    out.set(r.proposalId, m);
  }
  return out;
}

/** The cycle's offered configurations with their stations and site, in name order. */
async function offeredConfigurations(db: DbOrTx, cycleId: number) {
  const offers = await offersWithSites(db, { cycleId: cycleId });
  const ids = offers.map((o) => o.id);
  const members = ids.length
    ? await db
        .select({ configurationId: configurationStations.configurationId, station: stations })
        .from(configurationStations)
        .innerJoin(stations, eq(stations.id, configurationStations.stationId))
        .where(inArray(configurationStations.configurationId, ids))
        .orderBy(asc(configurationStations.position))
    : [];
  return offers.map((o) => ({
    id: o.id,
    name: o.name,
    nights: o.nights,
    site: o.site,
    stations: members
      .filter((m) => m.configurationId === o.id)
      .map(({ station: s }) => ({
        name: s.name,
        eastM: s.eastM,
        northM: s.northM,
        upM: s.upM,
        pathOffsetM: s.pathOffsetM,
      })),
  }));
}

/** Every record of the cycle's board, or null when there is no such cycle. */
export async function loadBoardRecords(db: DbOrTx, { cycleId }: { cycleId: number }) {
  const [cycle] = await db.select().from(cycles).where(eq(cycles.id, cycleId));
  if (!cycle) return null;
  const inCycle = and(eq(proposals.cycleId, cycleId), inArray(proposals.status, BOARD_STATUSES));
  const [settings, members, props, hours, targets, progress, scored, decisions, granted, offered] = await Promise.all([
    db.select().from(committeeBoards).where(eq(committeeBoards.cycleId, cycleId)),
    db
      .select({ id: users.id, name: users.name })
      .from(committeeMembers)
      .innerJoin(users, eq(users.id, committeeMembers.userId))
      .where(eq(committeeMembers.cycleId, cycleId))
      .orderBy(asc(users.id)),
    db
      .select({
        id: proposals.id,
        title: proposals.title,
        category: proposals.scienceCategory,
        status: proposals.status,
        pi: users.name,
      })
      .from(proposals)
      .innerJoin(users, piOfProposal)
      .where(inCycle),
    db
      .select({
        proposalId: proposalHours.proposalId,
        configurationId: proposalHours.configurationId,
        hours: proposalHours.hours,
      })
      .from(proposalHours)
      .innerJoin(proposals, eq(proposals.id, proposalHours.proposalId))
      .where(inCycle),
    db
      .select({
        proposalId: proposalTargets.proposalId,
        name: proposalTargets.name,
        raDeg: proposalTargets.raDeg,
        decDeg: proposalTargets.decDeg,
        minElevationDeg: proposalTargets.minElevationDeg,
      })
      .from(proposalTargets)
      .innerJoin(proposals, eq(proposals.id, proposalTargets.proposalId))
      .where(inCycle)
      .orderBy(asc(proposalTargets.proposalId), asc(proposalTargets.position), asc(proposalTargets.id)),
    db
      .select({
        proposalId: reviewAssignments.proposalId,
        assigned: sql<number>`count(*)::int`,
        submitted: sql<number>`count(${reviews.submittedAt})::int`,
      })
      .from(reviewAssignments)
      .leftJoin(reviews, reviewOfAssignment)
      .where(and(eq(reviewAssignments.cycleId, cycleId), activeAssignment))
      .groupBy(reviewAssignments.proposalId),
    db
      .select({
        proposalId: reviewAssignments.proposalId,
        reviewerId: reviewAssignments.reviewerId,
        score: reviews.score,
      })
      .from(reviews)
      .innerJoin(reviewAssignments, reviewOfAssignment)
      .innerJoin(proposals, proposalOfAssignment)
      .where(and(inCycle, submittedReview, isNotNull(reviews.score)))
      .orderBy(asc(reviewAssignments.id)),
    db.select().from(proposalDecisions).where(eq(proposalDecisions.cycleId, cycleId)),
    db
      .select({
        proposalId: allocatedHours.proposalId,
        configurationId: allocatedHours.configurationId,
        hours: allocatedHours.hours,
      })
      .from(allocatedHours)
      .innerJoin(proposals, eq(proposals.id, allocatedHours.proposalId))
      .where(eq(proposals.cycleId, cycleId)),
    offeredConfigurations(db, cycleId),
  ]);
  const reviewerIds = new Set(members.map((m) => m.id));
  const others = [...new Set(scored.map((s) => s.reviewerId).filter((id) => !reviewerIds.has(id)))].sort(
    (a, b) => a - b,
  );
  const otherNames = others.length
    ? await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, others))
    : [];
  const hoursBy = hoursMap(hours);
  const grantedBy = hoursMap(granted);
  const progressBy = new Map(progress.map((p) => [p.proposalId, p]));
  const targetsBy = new Map<number, BoardRecords["proposals"][number]["targets"]>();
  for (const t of targets) {
    const list = targetsBy.get(t.proposalId) ?? [];
    list.push({ name: t.name, raDeg: t.raDeg, decDeg: t.decDeg, minElevationDeg: t.minElevationDeg });
    targetsBy.set(t.proposalId, list);
  }
  const records: BoardRecords = {
    cycle: {
      id: cycle.id,
      name: cycle.name,
      state: cycle.state,
      scale: { best: cycle.scoreBest, worst: cycle.scoreWorst },
      observingStart: cycle.observingStart,
      observingEnd: cycle.observingEnd,
    },
    settings: {
      triageAfter: settings[0]?.triageAfter ?? null,
      disagreementSpread: settings[0]?.disagreementSpread ?? DEFAULT_DISAGREEMENT_SPREAD,
    },
    reviewers: [...members, ...others.map((id) => ({ id, name: otherNames.find((o) => o.id === id)?.name ?? "?" }))],
    proposals: props
      .sort((a, b) => a.id - b.id)
      .map((p) => ({
        ...p,
        hours: hoursBy.get(p.id) ?? {},
        targets: targetsBy.get(p.id) ?? [],
        assigned: progressBy.get(p.id)?.assigned ?? 0,
        submitted: progressBy.get(p.id)?.submitted ?? 0,
      })),
    reviews: scored.map((s) => ({ proposalId: s.proposalId, reviewerId: s.reviewerId, score: s.score! })),
    decisions: decisions.map((d) => ({
      proposalId: d.proposalId,
      finalGrade: d.finalGrade,
      decision: d.decision,
      message: d.message,
      releasedAt: d.releasedAt?.toISOString() ?? null,
      hours: grantedBy.get(d.proposalId) ?? {},
    })),
    configurations: offered.map((o) => ({
      id: o.id,
      name: o.name,
      nights: o.nights,
      siteId: o.site.id,
      stations: o.stations,
      delayLineStrokeM: o.site.delayLineStrokeM,
      minElevationDeg: o.site.minElevationDeg,
    })),
  };
  const siteList = [...new Map(offered.map((o) => [o.site.id, o.site])).values()];
  return { cycle, records, sites: siteList };
}

/** The computed board of a cycle, or null when there is no such cycle. */
export async function loadBoard(db: DbOrTx, { cycleId }: { cycleId: number }): Promise<Board | null> {
  const loaded = await loadBoardRecords(db, { cycleId });
  if (!loaded) return null;
  const dark = await cycleDarkness(db, {
    cycleId,
    first: loaded.cycle.observingStart,
    last: loaded.cycle.observingEnd,
    sites: loaded.sites,
  });
  return computeBoard(loaded.records, dark);
}
