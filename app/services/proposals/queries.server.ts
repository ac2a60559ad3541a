/**
 * Reading proposals: a person's list, the open cycles, a proposal's targets, hours and configurations,
 * what it still lacks. The caller has checked who may see the proposal (access.server.ts), except for
 * the list, which is scoped to the viewer here.
 */
import { asc, desc, eq, inArray, type SQLWrapper, sql } from "drizzle-orm";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import type { Database, DbOrTx } from "~/db/client.server";
import { configurationStations, configurations } from "~/db/schema/array";
import {
  cycleConfigurations,
  cycles,
  proposalDocuments,
  proposalHours,
  proposals,
  proposalTargets,
} from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { openCycles } from "~/services/cycles/cycles.server";
import { onTeamCondition, type ProposalViewer } from "./access.server";

/** `(select count(*) from table where column = id)` as an integer. */
const countWhere = (table: PgTable, column: PgColumn, id: SQLWrapper | number) =>
  sql<number>`(select count(*)::int from ${table} where ${column} = ${id})`;

/** The proposals where the viewer is PI or co-investigator, newest change first. */
export async function listMyProposals(db: Database, { viewer }: { viewer: ProposalViewer }) {
  const rows = await db
    .select({
      id: proposals.id,
      title: proposals.title,
      status: proposals.status,
      piId: proposals.piId,
      piName: users.name,
      cycleName: cycles.name,
      deadline: cycles.submissionDeadline,
      submittedAt: proposals.submittedAt,
      currentVersion: proposals.currentVersion,
      updatedAt: proposals.updatedAt,
      targets: countWhere(proposalTargets, proposalTargets.proposalId, proposals.id),
      hours: sql<number>`(select coalesce(sum(${proposalHours.hours}), 0)::float8 from ${proposalHours} where ${proposalHours.proposalId} = ${proposals.id})`,
    })
    .from(proposals)
    .innerJoin(cycles, eq(cycles.id, proposals.cycleId))
    .innerJoin(users, eq(users.id, proposals.piId))
    .where(onTeamCondition(viewer))
    .orderBy(desc(proposals.updatedAt), desc(proposals.id));
  return rows.map((r) => ({ ...r, role: r.piId === viewer.user.id ? ("PI" as const) : ("Co-I" as const) }));
}

/** The cycles a new proposal may go to at `now` (deadline ahead), soonest deadline first. */
export function listOpenCycles(db: Database, { now }: { now: Date }) {
  return openCycles(db, now);
}

/** A proposal's targets in their order. */
export function proposalTargetRows(db: DbOrTx, { proposalId }: { proposalId: number }) {
  return db
    .select()
    .from(proposalTargets)
    .where(eq(proposalTargets.proposalId, proposalId))
    .orderBy(asc(proposalTargets.position), asc(proposalTargets.id));
}

/** The hours a proposal requests, with each configuration's row, by configuration name. */
export function requestedHours(db: DbOrTx, { proposalId }: { proposalId: number }) {
  return db
    .select({ hours: proposalHours.hours, configuration: configurations })
    .from(proposalHours)
    .innerJoin(configurations, eq(configurations.id, proposalHours.configurationId))
    .where(eq(proposalHours.proposalId, proposalId))
    .orderBy(asc(configurations.name));
}

/** Configurations by id, by name, each with its stations in configuration order. */
export async function configurationsWithStations(db: DbOrTx, { configurationIds }: { configurationIds: number[] }) {
  if (configurationIds.length === 0) return [];
  const rows = await db.query.configurations.findMany({
    where: inArray(configurations.id, configurationIds),
    orderBy: asc(configurations.name),
    with: { stations: { orderBy: asc(configurationStations.position), with: { station: true } } },
  });
  return rows.map(({ stations, ...c }) => ({ ...c, stations: stations.map((m) => m.station) }));
}

/** The configurations a cycle offers, by name, with their stations in order. */
export async function offeredConfigurations(db: DbOrTx, { cycleId }: { cycleId: number }) {
  const offers = await db.query.cycleConfigurations.findMany({ where: eq(cycleConfigurations.cycleId, cycleId) });
  return configurationsWithStations(db, { configurationIds: offers.map((o) => o.configurationId) });
}

/** What a proposal still lacks before it can be submitted, in plain words (empty: complete). */
export async function missingForSubmission(
  db: DbOrTx,
  { proposal }: { proposal: typeof proposals.$inferSelect },
): Promise<string[]> {
  const [n] = await db
    .select({
      targets: countWhere(proposalTargets, proposalTargets.proposalId, proposal.id),
      hours: countWhere(proposalHours, proposalHours.proposalId, proposal.id),
      documents: countWhere(proposalDocuments, proposalDocuments.proposalId, proposal.id),
    })
    .from(proposals)
    .where(eq(proposals.id, proposal.id));
  const missing: string[] = [];
  if (proposal.title.trim() === "") missing.push("a title");
  if (proposal.abstract.trim() === "") missing.push("an abstract");
  if (proposal.scienceCategory === "") missing.push("a science category");
  if (proposal.bandId === null || proposal.instrumentId === null) missing.push("an instrument and band");
  if (n.targets === 0) missing.push("at least one target");
  if (n.hours === 0) missing.push("requested hours for at least one configuration");
  if (n.documents === 0) missing.push("the science case (PDF)");
  return missing;
}
