/**
 * The closure triangle of a proposal's target, chosen in the Triangle finder: checked against the
 * registry (the site, the instrument and band, the configuration it was ranked for, its three
 * stations in that configuration, or at the site for a pool of every station) and written under the
 * proposal's lock, like every change to a draft.
 */
import { and, eq, inArray } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, sites, stations } from "~/db/schema/array";
import { type ClosureTriangleJson, proposalTargets } from "~/db/schema/proposals";
import { editDraft, type ProposalRef, ProposalRefusal } from "./lock.server";

const refuse = (field: string, message: string): never => {
  throw new ProposalRefusal(400, message, field);
};

/** Refuses a triangle that does not match the registry (status 400 naming the field). */
async function checkTriangle(tx: Transaction, t: ClosureTriangleJson) {
  const [site] = await tx.select({ id: sites.id }).from(sites).where(eq(sites.name, t.site));
  if (!site) refuse("site", `Site: there is no site called ${t.site}.`);
  const [instrument] = await tx
    .select({ id: instruments.id, maxTelescopes: instruments.maxTelescopes })
    .from(instruments)
    .where(and(eq(instruments.siteId, site.id), eq(instruments.name, t.instrument)));
  if (!instrument) refuse("instrument", `Instrument: ${t.site} has no instrument called ${t.instrument}.`);
  if (instrument.maxTelescopes < 3)
    refuse("instrument", `Instrument: ${t.instrument} combines ${instrument.maxTelescopes} telescopes, not three.`);
  const [band] = await tx
    .select({ id: bands.id })
    .from(bands)
    .where(and(eq(bands.instrumentId, instrument.id), eq(bands.name, t.band)));
  if (!band) refuse("band", `Band: ${t.instrument} has no band called ${t.band}.`);
  let members: string[];
  if (t.configuration === null) {
    const rows = await tx
      .select({ name: stations.name })
      .from(stations)
      .where(and(eq(stations.siteId, site.id), inArray(stations.name, t.stations)));
    members = rows.map((r) => r.name);
  } else {
    const [config] = await tx
      .select({ id: configurations.id })
      .from(configurations)
      .where(and(eq(configurations.siteId, site.id), eq(configurations.name, t.configuration)));
    if (!config) refuse("pool", `Pool: ${t.site} has no configuration called ${t.configuration}.`);
    const rows = await tx
      .select({ name: stations.name })
      .from(configurationStations)
      .innerJoin(stations, eq(stations.id, configurationStations.stationId))
      .where(eq(configurationStations.configurationId, config.id));
    members = rows.map((r) => r.name);
  }
  const outside = t.stations.filter((s) => !members.includes(s));
  if (outside.length > 0) {
    const where = t.configuration === null ? `stations of ${t.site}` : `in configuration ${t.configuration}`;
    refuse("stations", `Stations: ${outside.join(", ")} ${outside.length > 1 ? "are" : "is"} not ${where}.`);
  }
}

/** Stores `triangle` on the proposal's target `targetId`. Returns the target's name. */
export async function chooseTriangle(
  db: Database,
  { targetId, triangle, ...ref }: ProposalRef & { targetId: number; triangle: ClosureTriangleJson },
) {
  return editDraft(db, ref, async ({ tx, proposalId }) => {
    await checkTriangle(tx, triangle);
    const rows = await tx
      .update(proposalTargets)
      .set({ closureTriangle: triangle })
      .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)))
      .returning({ name: proposalTargets.name });
    if (rows.length === 0) throw new ProposalRefusal(400, "Target: that target is not in the proposal (any more).");
    return rows[0].name;
  });
}
