/**
 * A small committee world for the committee's tests, written quickly: the demo registry (no demo
 * proposals), people with institutes, a cycle in the state asked for with its committee, and submitted
 * proposals with frozen versions (as the app freezes them).
 */
import { settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { bands, configurations } from "~/db/schema/array";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import type { CycleState } from "~/db/schema/proposals";
import {
  cycles,
  proposalDocuments,
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
} from "~/db/schema/proposals";
import {
  ensureConfiguration,
  ensureInstrument,
  ensureSite,
  ensureStations,
  ensureUser,
} from "~/db/seed/factories.server";
import { DEMO_CONFIGURATIONS, DEMO_INSTRUMENTS, DEMO_SITE, DEMO_STATIONS } from "~/db/seed/scenario";
import { createSession } from "~/services/auth/sessions.server";
import { createCycle } from "~/services/cycles/cycles.server";
import { makeTinyPdf } from "~/services/proposals/pdf";
import { sha256Hex } from "~/services/proposals/science-case.server";
import { freezeVersion } from "~/services/proposals/versions.server";

const DAY = 86_400_000;

export async function registry(db: Database = testDb()) {
  const site = await ensureSite(db, { ...DEMO_SITE });
  await ensureStations(db, site.id, DEMO_STATIONS);
  for (const c of DEMO_CONFIGURATIONS) await ensureConfiguration(db, site.id, c);
  for (const i of DEMO_INSTRUMENTS) await ensureInstrument(db, site.id, i);
  const configs = await db.select().from(configurations);
  const [h] = await db.select().from(bands).where(eq(bands.name, "H"));
  return { site, configId: Object.fromEntries(configs.map((c) => [c.name, c.id])) as Record<string, number>, bandH: h };
}

export async function person(
  key: string,
  {
    institute = `${key} Institute`,
    roles = ["reviewer"] as ("reviewer" | "chair" | "proposer" | "scheduler" | "admin")[],
  } = {},
) {
  const email = `${key.toLowerCase().replace(/[^a-z0-9]+/g, ".")}@world.example`;
  const user = await ensureUser(testDb(), { email, name: key, institute, roles });
  const { token } = await createSession(testDb(), user.id, { method: "sso" });
  return { ...user, cookie: `fd_session=${token}` };
}

/** A person of the world, with a session cookie. */
export type Who = Awaited<ReturnType<typeof person>>;

/** What a committee test fills in before its tests: the chair, two reviewers and their cycle. */
export type CommitteeWorld = { chair: Who; r1: Who; r2: Who; cycleId: number };

export async function committeeCycle(
  name: string,
  {
    state = "reviewing",
    members = [],
    configIds,
    deadlineDays = -5,
    reviewDays = 10,
  }: { state?: CycleState; members?: number[]; configIds: number[]; deadlineDays?: number; reviewDays?: number },
) {
  const now = Date.now();
  return createCycle(
    testDb(),
    {
      name,
      description: "",
      observingStart: new Date(now + 60 * DAY).toISOString().slice(0, 10),
      observingEnd: new Date(now + 90 * DAY).toISOString().slice(0, 10),
      submissionDeadline: new Date(now + deadlineDays * DAY),
      reviewDeadline: new Date(now + reviewDays * DAY),
      decisionDate: null,
      state,
      offers: configIds.map((id) => ({ configurationId: id, nightsAvailable: 3 })),
      committee: members,
    },
    null,
  );
}

/** A proposal submitted to the cycle (version 1 frozen), then put in `status`. */
export async function submitted(
  cycleId: number,
  {
    pi,
    coIs = [],
    title,
    category = "Stellar surfaces and diameters",
    hours,
    bandId,
    raDeg = 150,
    decDeg = -35,
    status = "under_review",
    pdf = false,
  }: {
    pi: number;
    coIs?: { id: number; email: string }[];
    title: string;
    category?: string;
    hours: Record<number, number>;
    bandId: number;
    raDeg?: number;
    decDeg?: number;
    status?: "submitted" | "under_review" | "withdrawn";
    pdf?: boolean;
  },
) {
  return testDb().transaction(async (tx) => {
    const [p] = await tx
      .insert(proposals)
      .values({ cycleId, piId: pi, title, abstract: `Abstract of ${title}.`, scienceCategory: category, bandId })
      .returning();
    for (const c of coIs) await tx.insert(proposalMembers).values({ proposalId: p.id, email: c.email, userId: c.id });
    for (const [cid, h] of Object.entries(hours))
      await tx.insert(proposalHours).values({ proposalId: p.id, configurationId: Number(cid), hours: h });
    await tx.insert(proposalTargets).values({
      proposalId: p.id,
      name: `${title} target`,
      raDeg,
      decDeg,
      model: { type: "uniformDisk", diameterMas: 2 },
      magnitudes: { H: 3 },
    });
    if (pdf) {
      const bytes = makeTinyPdf([title, "Science case for the committee's tests."]);
      await tx.insert(proposalDocuments).values({
        proposalId: p.id,
        filename: "case.pdf",
        contentType: "application/pdf",
        sizeBytes: bytes.length,
        sha256: sha256Hex(bytes),
        data: Buffer.from(bytes),
      });
    }
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
    const [locked] = await tx.select().from(proposals).where(eq(proposals.id, p.id)).for("update");
    await freezeVersion(tx, { proposal: locked, cycle, submittedById: pi, now: new Date(Date.now() - 6 * DAY) });
    if (status !== "submitted") await tx.update(proposals).set({ status }).where(eq(proposals.id, p.id));
    return p.id;
  });
}

/** `reviewerId` assigned to the proposal and their review of it already submitted, with `review`'s score and comments. */
export async function submittedReview(
  cycleId: number,
  proposalId: number,
  reviewerId: number,
  review: { score: number; commentToPi: string; commentToCommittee?: string },
) {
  const [a] = await testDb().insert(reviewAssignments).values({ cycleId, proposalId, reviewerId }).returning();
  await testDb()
    .insert(reviews)
    .values({ assignmentId: a.id, ...review, submittedAt: new Date() });
  return a.id;
}

/** A loader's or action's answer as a Response: plain data as 200 JSON (see `settle`). */
export const answer = (fn: () => unknown) =>
  settle(async () => {
    const out = await fn();
    return out instanceof Response || (out as { type?: string })?.type === "DataWithResponseInit"
      ? out
      : Response.json(out);
  });
