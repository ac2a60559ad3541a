/**
 * Proposals: reading a person's proposals and changing them. Every change runs in a transaction
 * that locks the proposal row and asks proposals-access.server.ts whether the person may make it
 * now (so a change never slips in after a submission or the deadline). Inputs arrive validated by
 * the route's schema; the limits they are checked against live here.
 */
import { createHash } from "node:crypto";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { createElement } from "react";
import type { Database, DbOrTx, Transaction } from "~/db/client.server";
import { bands, configurationStations, configurations, instruments, stations } from "~/db/schema/array";
import type { MailKind } from "~/db/schema/mail";
import {
  type CalibratorJson,
  cycleConfigurations,
  cycles,
  type MagnitudesJson,
  type ProposalStatus,
  proposalDocuments,
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
  proposalVersions,
  type TargetModelJson,
  type TimeWindowJson,
  targets,
} from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { CoInvestigatorAddedEmail } from "~/emails/CoInvestigatorAddedEmail";
import { ProposalSubmittedEmail } from "~/emails/ProposalSubmittedEmail";
import { ProposalWithdrawnEmail } from "~/emails/ProposalWithdrawnEmail";
import { env } from "~/env.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import {
  abilitiesFor,
  onTeamCondition,
  type ProposalAbilities,
  type ProposalViewer,
  proposalNotFound,
} from "~/services/proposals/access.server";
import { computeFeasibility, type FeasibilityReport } from "~/services/proposals/feasibility";
import { loadFeasibilityInput } from "~/services/proposals/feasibility.server";
import { checkPdf, formatBytes } from "~/services/proposals/pdf";

// ---------------------------------------------------------------- limits

/** The limits a proposal's fields are held to (shown on the pages, checked by the schemas). */
export const PROPOSAL_LIMITS = {
  titleMaxChars: 200,
  abstractMaxWords: 300,
  abstractMaxChars: 4000,
  hoursMax: 200,
  coInvestigatorsMax: 30,
  targetsMax: 50,
  targetNotesMaxChars: 2000,
  windowsMax: 20,
  calibratorsMax: 10,
} as const;

/** The mail kind of each notice (the outbox keeps a fixed list of kinds). */
const NOTICE_KIND = {
  coInvestigator: "co-investigator",
  submitted: "submission",
  withdrawn: "withdrawal",
} as const satisfies Record<string, MailKind>;

// ---------------------------------------------------------------- refusals

/**
 * A change the person may not make now, with the message to show and the status to answer:
 * 403 when their place on the team does not allow it, 409 when the proposal's state or the
 * deadline does not, 400 for a problem with what was sent.
 */
export class ProposalRefusal extends Error {
  constructor(
    public readonly status: 400 | 403 | 409,
    message: string,
    /** The form field the message is about, when there is one. */
    public readonly field: string | null = null,
  ) {
    super(message);
  }
}

/** "2027-01-15 12:00 UTC" */
export function formatUtc(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** Time left before a deadline in plain words: "44 days left", "5 hours left", "closed". */
export function deadlineCountdown(deadline: Date, now: Date = new Date()): string {
  const ms = deadline.getTime() - now.getTime();
  if (ms <= 0) return "closed";
  const hours = ms / 3_600_000;
  if (hours < 1) return `${Math.max(1, Math.floor(ms / 60_000))} min left`;
  if (hours < 48) return `${Math.floor(hours)} hour${Math.floor(hours) === 1 ? "" : "s"} left`;
  return `${Math.floor(hours / 24)} days left`;
}

type Tx = Transaction;

type Need = "canEdit" | "canManageTeam" | "canSubmit" | "canWithdraw" | "canReopen";

function refusalFor(
  need: Need,
  abilities: ProposalAbilities,
  cycle: { name: string; submissionDeadline: Date },
  status: ProposalStatus,
): ProposalRefusal {
  const deadline = `${cycle.name} deadline (${formatUtc(cycle.submissionDeadline)})`;
  switch (need) {
    case "canManageTeam":
      if (abilities.relation === "co-investigator")
        return new ProposalRefusal(403, "Only the PI adds or removes co-investigators.");
      break;
    case "canWithdraw":
      if (abilities.relation !== "pi") return new ProposalRefusal(403, "Only the PI can withdraw the proposal.");
      return new ProposalRefusal(409, `A proposal that is ${STATUS_WORDS[status].toLowerCase()} cannot be withdrawn.`);
    case "canReopen":
      if (abilities.relation !== "pi") return new ProposalRefusal(403, "Only the PI can reopen the proposal.");
      if (status !== "withdrawn")
        return new ProposalRefusal(409, "Only a withdrawn proposal can be reopened as a draft.");
      return new ProposalRefusal(409, `The ${deadline} has passed: the proposal can no longer be reopened.`);
    case "canSubmit":
      if (status !== "draft")
        return new ProposalRefusal(409, "This proposal has already been submitted; withdraw it first to change it.");
      if (abilities.deadlinePassed)
        return new ProposalRefusal(409, `Too late: the ${deadline} has passed, so the proposal cannot be submitted.`);
      break;
  }
  if (status !== "draft") return new ProposalRefusal(409, "The proposal is no longer a draft: it is read-only.");
  if (abilities.deadlinePassed)
    return new ProposalRefusal(409, `The ${deadline} has passed: the draft can no longer be changed.`);
  return new ProposalRefusal(403, abilities.lockedBecause ?? "You may not change this proposal.");
}

/**
 * Locks the proposal row for the rest of the transaction and checks that the viewer may do `need`.
 * Throws the 404 when the viewer may not see it, a ProposalRefusal when they may not do it.
 */
async function lockFor(tx: Tx, viewer: ProposalViewer, proposalId: number, need: Need, now: Date) {
  const [proposal] = await tx.select().from(proposals).where(eq(proposals.id, proposalId)).for("update");
  if (!proposal) proposalNotFound();
  const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, proposal.cycleId));
  const members = await tx
    .select()
    .from(proposalMembers)
    .where(eq(proposalMembers.proposalId, proposalId))
    .orderBy(proposalMembers.id);
  const abilities = abilitiesFor(viewer, { piId: proposal.piId, status: proposal.status, members }, cycle, now);
  if (!abilities.canView) proposalNotFound();
  if (!abilities[need]) throw refusalFor(need, abilities, cycle, proposal.status);
  return { proposal, cycle, members, abilities };
}

async function touch(tx: Tx, proposalId: number) {
  await tx.update(proposals).set({ updatedAt: new Date() }).where(eq(proposals.id, proposalId));
}

function proposalUrl(id: number) {
  return `${env().APP_ORIGIN.replace(/\/$/, "")}/proposals/${id}`;
}

// ---------------------------------------------------------------- words

/** Our words for each status, as the pages and the notices show them. */
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

// ---------------------------------------------------------------- reading

/** The proposals where the viewer is PI or co-investigator, newest change first. */
export async function listMyProposals(db: Database, viewer: ProposalViewer) {
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
      targets: sql<number>`(select count(*)::int from ${proposalTargets} where ${proposalTargets.proposalId} = ${proposals.id})`,
      hours: sql<number>`(select coalesce(sum(${proposalHours.hours}), 0)::float8 from ${proposalHours} where ${proposalHours.proposalId} = ${proposals.id})`,
    })
    .from(proposals)
    .innerJoin(cycles, eq(cycles.id, proposals.cycleId))
    .innerJoin(users, eq(users.id, proposals.piId))
    .where(onTeamCondition(viewer))
    .orderBy(desc(proposals.updatedAt), desc(proposals.id));
  return rows.map((r) => ({ ...r, role: r.piId === viewer.user.id ? ("PI" as const) : ("Co-I" as const) }));
}

/** Everything the editor shows besides the proposal row itself. */
export async function loadProposalDetails(db: Database, proposalId: number, cycleId: number, viewerId: number) {
  const [hours, targetRows, document, versions, offered, bandRows, myTargets, memberUsers] = await Promise.all([
    db
      .select({ configurationId: proposalHours.configurationId, hours: proposalHours.hours, name: configurations.name })
      .from(proposalHours)
      .innerJoin(configurations, eq(configurations.id, proposalHours.configurationId))
      .where(eq(proposalHours.proposalId, proposalId))
      .orderBy(asc(configurations.name)),
    db
      .select()
      .from(proposalTargets)
      .where(eq(proposalTargets.proposalId, proposalId))
      .orderBy(asc(proposalTargets.position), asc(proposalTargets.id)),
    db
      .select({
        filename: proposalDocuments.filename,
        sizeBytes: proposalDocuments.sizeBytes,
        sha256: proposalDocuments.sha256,
        uploadedAt: proposalDocuments.uploadedAt,
        uploadedBy: users.name,
      })
      .from(proposalDocuments)
      .leftJoin(users, eq(users.id, proposalDocuments.uploadedById))
      .where(eq(proposalDocuments.proposalId, proposalId))
      .then((r) => r[0] ?? null),
    db
      .select({
        version: proposalVersions.version,
        submittedAt: proposalVersions.submittedAt,
        submittedBy: users.name,
        documentSha256: proposalVersions.documentSha256,
      })
      .from(proposalVersions)
      .leftJoin(users, eq(users.id, proposalVersions.submittedById))
      .where(eq(proposalVersions.proposalId, proposalId))
      .orderBy(desc(proposalVersions.version)),
    offeredConfigurations(db, cycleId),
    db
      .select({ band: bands, instrumentName: instruments.name, maxTelescopes: instruments.maxTelescopes })
      .from(bands)
      .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
      .orderBy(asc(instruments.name), asc(bands.centralWavelengthM)),
    db.select().from(targets).where(eq(targets.ownerId, viewerId)).orderBy(asc(targets.name)),
    db
      .select({ memberId: proposalMembers.id, name: users.name })
      .from(proposalMembers)
      .innerJoin(users, eq(users.id, proposalMembers.userId))
      .where(eq(proposalMembers.proposalId, proposalId)),
  ]);
  return { hours, targets: targetRows, document, versions, offered, bands: bandRows, myTargets, memberUsers };
}

/** The configurations a cycle offers, with their stations in order. */
export async function offeredConfigurations(db: DbOrTx, cycleId: number) {
  const rows = await db
    .select({
      id: configurations.id,
      name: configurations.name,
      description: configurations.description,
      nightsAvailable: cycleConfigurations.nightsAvailable,
    })
    .from(cycleConfigurations)
    .innerJoin(configurations, eq(configurations.id, cycleConfigurations.configurationId))
    .where(eq(cycleConfigurations.cycleId, cycleId))
    .orderBy(asc(configurations.name));
  if (rows.length === 0) return [];
  const members = await db
    .select({ configurationId: configurationStations.configurationId, name: stations.name })
    .from(configurationStations)
    .innerJoin(stations, eq(stations.id, configurationStations.stationId))
    .where(
      inArray(
        configurationStations.configurationId,
        rows.map((r) => r.id),
      ),
    )
    .orderBy(asc(configurationStations.position));
  return rows.map((r) => ({
    ...r,
    stationNames: members.filter((m) => m.configurationId === r.id).map((m) => m.name),
  }));
}

// ---------------------------------------------------------------- creating

export async function createProposal(
  db: Database,
  viewer: ProposalViewer,
  input: { cycleId: number; title: string },
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, input.cycleId));
    if (!cycle) throw new ProposalRefusal(400, "Cycle: choose one of the open cycles.", "cycleId");
    if (cycle.submissionDeadline.getTime() <= now.getTime()) {
      throw new ProposalRefusal(
        409,
        `Cycle: the ${cycle.name} deadline (${formatUtc(cycle.submissionDeadline)}) has passed; choose an open cycle.`,
        "cycleId",
      );
    }
    const [row] = await tx
      .insert(proposals)
      .values({ cycleId: cycle.id, piId: viewer.user.id, title: input.title })
      .returning();
    return row;
  });
}

// ---------------------------------------------------------------- the text

export type DetailsInput = { title: string; abstract: string; scienceCategory: string; bandId: number | null };

/** Title, abstract, science category and band (the instrument follows the band). */
export async function saveDetails(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  input: DetailsInput,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    let instrumentId: number | null = null;
    if (input.bandId !== null) {
      const [band] = await tx.select().from(bands).where(eq(bands.id, input.bandId));
      if (!band) throw new ProposalRefusal(400, "Instrument and band: choose one of the bands listed.", "bandId");
      instrumentId = band.instrumentId;
    }
    const [row] = await tx
      .update(proposals)
      .set({
        title: input.title,
        abstract: input.abstract,
        scienceCategory: input.scienceCategory,
        bandId: input.bandId,
        instrumentId,
        updatedAt: now,
      })
      .where(eq(proposals.id, proposalId))
      .returning();
    return row;
  });
}

/** Replaces the requested hours: one line per configuration; configurations not listed are dropped. */
export async function saveHours(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  lines: { configurationId: number; hours: number }[],
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    const { proposal } = await lockFor(tx, viewer, proposalId, "canEdit", now);
    const offered = new Set((await offeredConfigurations(tx, proposal.cycleId)).map((c) => c.id));
    for (const l of lines) {
      if (!offered.has(l.configurationId))
        throw new ProposalRefusal(
          400,
          "Requested hours: that configuration is not on offer this cycle.",
          `hours-${l.configurationId}`,
        );
    }
    await tx.delete(proposalHours).where(eq(proposalHours.proposalId, proposalId));
    if (lines.length > 0) await tx.insert(proposalHours).values(lines.map((l) => ({ proposalId, ...l })));
    await touch(tx, proposalId);
  });
}

// ---------------------------------------------------------------- the team

/** Adds a co-investigator by e-mail and queues their notice. Returns the member row. */
export async function addCoInvestigator(
  db: Database,
  viewer: ProposalViewer & { user: { name: string } },
  proposalId: number,
  email: string,
  now: Date = new Date(),
) {
  const member = await db.transaction(async (tx) => {
    const { proposal, cycle, members } = await lockFor(tx, viewer, proposalId, "canManageTeam", now);
    const lower = email.trim().toLowerCase();
    const [pi] = await tx.select().from(users).where(eq(users.id, proposal.piId));
    if (pi && pi.email.toLowerCase() === lower)
      throw new ProposalRefusal(400, "Co-investigator e-mail: that is the PI's own address.", "email");
    if (members.some((m) => m.email.toLowerCase() === lower))
      throw new ProposalRefusal(400, `Co-investigator e-mail: ${email} is already on the team.`, "email");
    if (members.length >= PROPOSAL_LIMITS.coInvestigatorsMax) {
      throw new ProposalRefusal(
        400,
        `Co-investigator e-mail: a team has at most ${PROPOSAL_LIMITS.coInvestigatorsMax} co-investigators.`,
        "email",
      );
    }
    const [account] = await tx.select().from(users).where(sql`lower(${users.email}) = ${lower}`);
    const [row] = await tx
      .insert(proposalMembers)
      .values({ proposalId, email: email.trim(), userId: account?.id ?? null, invitedAt: now })
      .returning();
    await touch(tx, proposalId);
    await enqueueMail(tx, {
      kind: NOTICE_KIND.coInvestigator,
      to: row.email,
      subject: `You are a co-investigator on "${clip(proposal.title, 120)}"`,
      element: createElement(CoInvestigatorAddedEmail, {
        name: account?.name ?? null,
        piName: viewer.user.name,
        title: proposal.title,
        cycleName: cycle.name,
        deadline: formatUtc(cycle.submissionDeadline),
        url: proposalUrl(proposalId),
        hasAccount: !!account,
      }),
      userId: account?.id ?? null,
      relatedUrl: proposalUrl(proposalId),
    });
    return row;
  });
  return member;
}

export async function removeCoInvestigator(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  memberId: number,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canManageTeam", now);
    const gone = await tx
      .delete(proposalMembers)
      .where(and(eq(proposalMembers.id, memberId), eq(proposalMembers.proposalId, proposalId)))
      .returning();
    if (gone.length === 0) throw new ProposalRefusal(400, "That person is not on the team (any more).");
    await touch(tx, proposalId);
    return gone[0];
  });
}

// ---------------------------------------------------------------- targets

export type TargetFields = {
  name: string;
  raDeg: number;
  decDeg: number;
  model: TargetModelJson;
  magnitudes: MagnitudesJson;
  minElevationDeg: number | null;
  timeWindows: TimeWindowJson[];
  calibrators: CalibratorJson[];
  notes: string;
};

async function nextPosition(tx: Tx, proposalId: number) {
  const [row] = await tx
    .select({
      n: sql<number>`coalesce(max(${proposalTargets.position}), -1)::int + 1`,
      count: sql<number>`count(*)::int`,
    })
    .from(proposalTargets)
    .where(eq(proposalTargets.proposalId, proposalId));
  if (row.count >= PROPOSAL_LIMITS.targetsMax)
    throw new ProposalRefusal(400, `Targets: a proposal has at most ${PROPOSAL_LIMITS.targetsMax} targets.`);
  return row.n;
}

async function refuseDuplicateName(tx: Tx, proposalId: number, name: string, exceptId: number | null) {
  const same = await tx
    .select({ id: proposalTargets.id })
    .from(proposalTargets)
    .where(and(eq(proposalTargets.proposalId, proposalId), sql`lower(${proposalTargets.name}) = lower(${name})`));
  if (same.some((s) => s.id !== exceptId))
    throw new ProposalRefusal(400, `Name: the proposal already has a target called "${name}".`, "name");
}

/** Creates (targetId null) or updates a target of the proposal. Returns its id. */
export async function saveTarget(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  targetId: number | null,
  input: TargetFields,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    await refuseDuplicateName(tx, proposalId, input.name, targetId);
    let id: number;
    if (targetId === null) {
      const position = await nextPosition(tx, proposalId);
      const [row] = await tx
        .insert(proposalTargets)
        .values({ proposalId, position, ...input })
        .returning({ id: proposalTargets.id });
      id = row.id;
    } else {
      const rows = await tx
        .update(proposalTargets)
        .set(input)
        .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)))
        .returning({ id: proposalTargets.id });
      if (rows.length === 0) proposalNotFound();
      id = rows[0].id;
    }
    await touch(tx, proposalId);
    return id;
  });
}

/** Copies one of the viewer's own targets ("My targets") into the proposal. */
export async function addTargetFromMine(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  myTargetId: number,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    const [mine] = await tx
      .select()
      .from(targets)
      .where(and(eq(targets.id, myTargetId), eq(targets.ownerId, viewer.user.id)));
    if (!mine) throw new ProposalRefusal(400, "From my targets: choose one of your own targets.", "myTargetId");
    await refuseDuplicateName(tx, proposalId, mine.name, null);
    const position = await nextPosition(tx, proposalId);
    const [row] = await tx
      .insert(proposalTargets)
      .values({
        proposalId,
        position,
        sourceTargetId: mine.id,
        name: mine.name,
        raDeg: mine.raDeg,
        decDeg: mine.decDeg,
        model: mine.model,
        magnitudes: mine.magnitudes,
        notes: mine.notes,
      })
      .returning();
    await touch(tx, proposalId);
    return row;
  });
}

export async function removeTarget(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  targetId: number,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    const gone = await tx
      .delete(proposalTargets)
      .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)))
      .returning();
    if (gone.length === 0) throw new ProposalRefusal(400, "That target is not in the proposal (any more).");
    await touch(tx, proposalId);
    return gone[0];
  });
}

/** Moves a target one place up or down the list (positions are renumbered 0, 1, 2 …). */
export async function moveTarget(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  targetId: number,
  direction: "up" | "down",
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    const list = await tx
      .select({ id: proposalTargets.id })
      .from(proposalTargets)
      .where(eq(proposalTargets.proposalId, proposalId))
      .orderBy(asc(proposalTargets.position), asc(proposalTargets.id));
    const at = list.findIndex((t) => t.id === targetId);
    if (at < 0) throw new ProposalRefusal(400, "That target is not in the proposal (any more).");
    const to = direction === "up" ? at - 1 : at + 1;
    if (to >= 0 && to < list.length) [list[at], list[to]] = [list[to], list[at]];
    for (let i = 0; i < list.length; i++) {
      await tx.update(proposalTargets).set({ position: i }).where(eq(proposalTargets.id, list[i].id));
    }
    await touch(tx, proposalId);
  });
}

// ---------------------------------------------------------------- the science case

export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** Keeps a file name readable and safe for a Content-Disposition header. */
export function cleanFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const cleaned = base
    .replace(/[^\w.\- ()]+/g, "_")
    .replace(/^\.+/, "")
    .trim()
    .slice(0, 120);
  const withName = cleaned === "" ? "science-case" : cleaned;
  return /\.pdf$/i.test(withName) ? withName : `${withName}.pdf`;
}

/** Stores (or replaces) the science case after checking by content that it is a PDF. */
export async function uploadScienceCase(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  file: { filename: string; bytes: Uint8Array },
  now: Date = new Date(),
) {
  const check = checkPdf(file.bytes);
  if (!check.ok) throw new ProposalRefusal(400, `Science case: ${check.reason}`, "document");
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    const row = {
      filename: cleanFilename(file.filename),
      contentType: "application/pdf",
      sizeBytes: file.bytes.length,
      sha256: sha256Hex(file.bytes),
      data: Buffer.from(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength),
      uploadedById: viewer.user.id,
      uploadedAt: now,
    };
    await tx
      .insert(proposalDocuments)
      .values({ proposalId, ...row })
      .onConflictDoUpdate({ target: proposalDocuments.proposalId, set: row });
    await touch(tx, proposalId);
    return { filename: row.filename, sizeBytes: row.sizeBytes, sha256: row.sha256 };
  });
}

export async function removeScienceCase(
  db: Database,
  viewer: ProposalViewer,
  proposalId: number,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canEdit", now);
    await tx.delete(proposalDocuments).where(eq(proposalDocuments.proposalId, proposalId));
    await touch(tx, proposalId);
  });
}

/**
 * The science case bytes for someone allowed to see the proposal: the current one, or the one
 * frozen with a version. Null when there is none.
 */
export async function readScienceCase(db: Database, proposalId: number, version: number | null) {
  if (version === null) {
    const [doc] = await db.select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, proposalId));
    return doc ? { filename: doc.filename, contentType: doc.contentType, data: doc.data, sha256: doc.sha256 } : null;
  }
  const [row] = await db
    .select()
    .from(proposalVersions)
    .where(and(eq(proposalVersions.proposalId, proposalId), eq(proposalVersions.version, version)));
  if (!row?.documentData) return null;
  const snap = row.snapshot as { document?: { filename?: string } | null };
  return {
    filename: snap.document?.filename ?? `science-case-v${version}.pdf`,
    contentType: "application/pdf",
    data: row.documentData,
    sha256: row.documentSha256 ?? sha256Hex(row.documentData),
  };
}

// ---------------------------------------------------------------- submission

/** What a proposal still lacks before it can be submitted, in plain words (empty: complete). */
export async function missingForSubmission(db: DbOrTx, proposal: typeof proposals.$inferSelect): Promise<string[]> {
  const [[t], [h], [d]] = await Promise.all([
    db
      .select({ n: sql<number>`count(*)::int` })
      .from(proposalTargets)
      .where(eq(proposalTargets.proposalId, proposal.id)),
    db.select({ n: sql<number>`count(*)::int` }).from(proposalHours).where(eq(proposalHours.proposalId, proposal.id)),
    db
      .select({ n: sql<number>`count(*)::int` })
      .from(proposalDocuments)
      .where(eq(proposalDocuments.proposalId, proposal.id)),
  ]);
  const missing: string[] = [];
  if (proposal.title.trim() === "") missing.push("a title");
  if (proposal.abstract.trim() === "") missing.push("an abstract");
  if (proposal.scienceCategory === "") missing.push("a science category");
  if (proposal.bandId === null || proposal.instrumentId === null) missing.push("an instrument and band");
  if (t.n === 0) missing.push("at least one target");
  if (h.n === 0) missing.push("requested hours for at least one configuration");
  if (d.n === 0) missing.push("the science case (PDF)");
  return missing;
}

/** The proposal as it stands, for a frozen version (everything but the PDF bytes). */
async function buildSnapshot(
  tx: Tx,
  proposal: typeof proposals.$inferSelect,
  cycle: typeof cycles.$inferSelect,
  report: FeasibilityReport,
) {
  const [pi] = await tx
    .select({ id: users.id, name: users.name, email: users.email, institute: users.institute })
    .from(users)
    .where(eq(users.id, proposal.piId));
  const members = await tx
    .select({ email: proposalMembers.email, name: users.name, institute: users.institute })
    .from(proposalMembers)
    .leftJoin(users, eq(users.id, proposalMembers.userId))
    .where(eq(proposalMembers.proposalId, proposal.id))
    .orderBy(proposalMembers.id);
  const hours = await tx
    .select({
      configurationId: proposalHours.configurationId,
      configuration: configurations.name,
      hours: proposalHours.hours,
    })
    .from(proposalHours)
    .innerJoin(configurations, eq(configurations.id, proposalHours.configurationId))
    .where(eq(proposalHours.proposalId, proposal.id))
    .orderBy(asc(configurations.name));
  const targetRows = await tx
    .select()
    .from(proposalTargets)
    .where(eq(proposalTargets.proposalId, proposal.id))
    .orderBy(asc(proposalTargets.position), asc(proposalTargets.id));
  const [band] = proposal.bandId
    ? await tx
        .select({
          id: bands.id,
          name: bands.name,
          instrument: instruments.name,
          centralWavelengthM: bands.centralWavelengthM,
          limitingMagnitude: bands.limitingMagnitude,
        })
        .from(bands)
        .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
        .where(eq(bands.id, proposal.bandId))
    : [];
  const [doc] = await tx
    .select({
      filename: proposalDocuments.filename,
      sizeBytes: proposalDocuments.sizeBytes,
      sha256: proposalDocuments.sha256,
      data: proposalDocuments.data,
    })
    .from(proposalDocuments)
    .where(eq(proposalDocuments.proposalId, proposal.id));
  const snapshot: ProposalSnapshot = {
    id: proposal.id,
    title: proposal.title,
    abstract: proposal.abstract,
    scienceCategory: proposal.scienceCategory,
    cycle: {
      id: cycle.id,
      name: cycle.name,
      observingStart: cycle.observingStart,
      observingEnd: cycle.observingEnd,
      submissionDeadline: cycle.submissionDeadline.toISOString(),
    },
    pi: pi ?? null,
    coInvestigators: members.map((m) => ({ email: m.email, name: m.name ?? null, institute: m.institute ?? null })),
    instrument: band
      ? {
          name: band.instrument,
          band: band.name,
          bandId: band.id,
          centralWavelengthM: band.centralWavelengthM,
          limitingMagnitude: band.limitingMagnitude,
        }
      : null,
    hours,
    targets: targetRows.map((t) => ({
      name: t.name,
      raDeg: t.raDeg,
      decDeg: t.decDeg,
      model: t.model,
      magnitudes: t.magnitudes,
      minElevationDeg: t.minElevationDeg,
      timeWindows: t.timeWindows,
      calibrators: t.calibrators,
      notes: t.notes,
    })),
    document: doc ? { filename: doc.filename, sizeBytes: doc.sizeBytes, sha256: doc.sha256 } : null,
    feasibility: report,
  };
  return { snapshot, documentData: doc?.data ?? null, documentSha256: doc?.sha256 ?? null };
}

export type ProposalSnapshot = {
  id: number;
  title: string;
  abstract: string;
  scienceCategory: string;
  cycle: { id: number; name: string; observingStart: string; observingEnd: string; submissionDeadline: string };
  pi: { id: number; name: string; email: string; institute: string } | null;
  coInvestigators: { email: string; name: string | null; institute: string | null }[];
  instrument: {
    name: string;
    band: string;
    bandId: number;
    centralWavelengthM: number;
    limitingMagnitude: number;
  } | null;
  hours: { configurationId: number; configuration: string; hours: number }[];
  targets: (TargetFields & { minElevationDeg: number | null })[];
  document: { filename: string; sizeBytes: number; sha256: string } | null;
  feasibility: FeasibilityReport;
};

/**
 * Freezes the proposal as it stands into a new version (snapshot with the feasibility report, the
 * PDF bytes and their SHA-256) and marks it submitted. Runs inside the caller's transaction, which
 * must hold the proposal's row lock.
 */
export async function freezeVersion(
  tx: Tx,
  proposal: typeof proposals.$inferSelect,
  cycle: typeof cycles.$inferSelect,
  submittedById: number,
  now: Date,
) {
  const report = computeFeasibility(await loadFeasibilityInput(tx, proposal.id), now);
  const { snapshot, documentData, documentSha256 } = await buildSnapshot(tx, proposal, cycle, report);
  const version = proposal.currentVersion + 1;
  await tx.insert(proposalVersions).values({
    proposalId: proposal.id,
    version,
    submittedAt: now,
    submittedById,
    snapshot,
    documentData,
    documentSha256,
  });
  await tx
    .update(proposals)
    .set({ status: "submitted", submittedAt: now, currentVersion: version, updatedAt: now })
    .where(eq(proposals.id, proposal.id));
  return { version, report, snapshot, documentSha256 };
}

/** Everyone a notice about the proposal goes to: the PI and every co-investigator. */
async function teamAddresses(tx: Tx, proposal: typeof proposals.$inferSelect) {
  const [pi] = await tx.select().from(users).where(eq(users.id, proposal.piId));
  const members = await tx
    .select({ email: proposalMembers.email, userId: proposalMembers.userId, name: users.name })
    .from(proposalMembers)
    .leftJoin(users, eq(users.id, proposalMembers.userId))
    .where(eq(proposalMembers.proposalId, proposal.id))
    .orderBy(proposalMembers.id);
  const out = [{ email: pi.email, name: pi.name as string | null, userId: pi.id as number | null }];
  for (const m of members) {
    if (!out.some((o) => o.email.toLowerCase() === m.email.toLowerCase()))
      out.push({ email: m.email, name: m.name, userId: m.userId });
  }
  return { pi, recipients: out };
}

/** One line of at most n characters, for a mail subject. */
const clip = (s: string, n: number) => {
  const line = s.replace(/\s+/g, " ").trim();
  return line.length <= n ? line : `${line.slice(0, n - 1)}…`;
};

/**
 * Submits the proposal: checks the deadline and completeness, freezes a new version with the
 * feasibility report and the PDF, marks it submitted and queues a notice to the whole team, all
 * in one transaction. Returns the version number.
 */
export async function submitProposal(
  db: Database,
  viewer: ProposalViewer & { user: { name: string } },
  proposalId: number,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    const { proposal, cycle } = await lockFor(tx, viewer, proposalId, "canSubmit", now);
    const missing = await missingForSubmission(tx, proposal);
    if (missing.length > 0)
      throw new ProposalRefusal(400, `The proposal is not complete yet. It still needs ${joinWords(missing)}.`);
    const { version, report, snapshot, documentSha256 } = await freezeVersion(tx, proposal, cycle, viewer.user.id, now);
    const { recipients } = await teamAddresses(tx, proposal);
    const totalHours = snapshot.hours.reduce((a, h) => a + h.hours, 0);
    for (const r of recipients) {
      await enqueueMail(tx, {
        kind: NOTICE_KIND.submitted,
        to: r.email,
        subject: `Proposal submitted: "${clip(proposal.title, 120)}" (${cycle.name})`,
        element: createElement(ProposalSubmittedEmail, {
          name: r.name,
          title: proposal.title,
          cycleName: cycle.name,
          version,
          submittedBy: viewer.user.name,
          submittedAt: formatUtc(now),
          deadline: formatUtc(cycle.submissionDeadline),
          targets: snapshot.targets.length,
          hours: totalHours,
          verdict: report.verdict,
          documentSha256: documentSha256 ?? "",
          url: proposalUrl(proposalId),
        }),
        userId: r.userId,
        relatedUrl: proposalUrl(proposalId),
      });
    }
    return { version, report };
  });
}

/** The PI pulls a submitted proposal back; the team is told. */
export async function withdrawProposal(
  db: Database,
  viewer: ProposalViewer & { user: { name: string } },
  proposalId: number,
  now: Date = new Date(),
) {
  return db.transaction(async (tx) => {
    const { proposal, cycle } = await lockFor(tx, viewer, proposalId, "canWithdraw", now);
    await tx.update(proposals).set({ status: "withdrawn", updatedAt: now }).where(eq(proposals.id, proposalId));
    const { recipients } = await teamAddresses(tx, proposal);
    const reopenable = now.getTime() < cycle.submissionDeadline.getTime();
    for (const r of recipients) {
      await enqueueMail(tx, {
        kind: NOTICE_KIND.withdrawn,
        to: r.email,
        subject: `Proposal withdrawn: "${clip(proposal.title, 120)}" (${cycle.name})`,
        element: createElement(ProposalWithdrawnEmail, {
          name: r.name,
          title: proposal.title,
          cycleName: cycle.name,
          withdrawnBy: viewer.user.name,
          reopenUntil: reopenable ? formatUtc(cycle.submissionDeadline) : null,
          url: proposalUrl(proposalId),
        }),
        userId: r.userId,
        relatedUrl: proposalUrl(proposalId),
      });
    }
  });
}

/** The PI turns a withdrawn proposal back into a draft (before the deadline). */
export async function reopenProposal(db: Database, viewer: ProposalViewer, proposalId: number, now: Date = new Date()) {
  return db.transaction(async (tx) => {
    await lockFor(tx, viewer, proposalId, "canReopen", now);
    await tx.update(proposals).set({ status: "draft", updatedAt: now }).where(eq(proposals.id, proposalId));
  });
}

/** One frozen version for someone allowed to see the proposal. */
export async function readVersion(db: Database, proposalId: number, version: number) {
  const [row] = await db
    .select({
      version: proposalVersions.version,
      submittedAt: proposalVersions.submittedAt,
      submittedBy: users.name,
      snapshot: proposalVersions.snapshot,
      documentSha256: proposalVersions.documentSha256,
      hasDocument: sql<boolean>`${proposalVersions.documentData} is not null`,
    })
    .from(proposalVersions)
    .leftJoin(users, eq(users.id, proposalVersions.submittedById))
    .where(and(eq(proposalVersions.proposalId, proposalId), eq(proposalVersions.version, version)));
  return row ? { ...row, snapshot: row.snapshot as unknown as ProposalSnapshot } : null;
}

function joinWords(items: string[]) {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

export { formatBytes };
