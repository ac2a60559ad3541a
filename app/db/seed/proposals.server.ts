/**
 * The demo proposals of app/db/seed/demo-proposals.ts written into their cycles: idempotent by (cycle,
 * PI, title), so the seed can run again. Positions, windows and submission instants follow the cycle
 * (and so the day the demo is loaded). Everything past draft gets version 1 frozen exactly as a real
 * submission would (snapshot, feasibility report computed by the engine, PDF bytes); the seed writes no
 * notices.
 */
import { and, eq, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { bands, configurations, instruments } from "~/db/schema/array";
import {
  cycles,
  proposalDocuments,
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
} from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { makeTinyPdf } from "~/services/proposals/pdf";
import { sha256Hex } from "~/services/proposals/science-case.server";
import { targetFieldsOf } from "~/services/proposals/targets.server";
import { freezeVersion } from "~/services/proposals/versions.server";
import { raTransitingAtMidnight } from "~/services/sketch/night";
import type { DemoProposal, DemoProposalTarget } from "./scenario";

const DAY_MS = 86_400_000;
const round2 = (x: number) => Math.round(x * 100) / 100;
const wrap360 = (x: number) => ((x % 360) + 360) % 360;

/** The middle night of a cycle (YYYY-MM-DD). */
function middleNight(cycle: { observingStart: string; observingEnd: string }) {
  const a = Date.parse(`${cycle.observingStart}T00:00:00Z`);
  const b = Date.parse(`${cycle.observingEnd}T00:00:00Z`);
  return new Date(a + Math.floor((b - a) / DAY_MS / 2) * DAY_MS).toISOString().slice(0, 10);
}

/** A demo target placed in its cycle: RA from the meridian at local midnight, windows from the first night. */
export function placeTarget(
  t: DemoProposalTarget,
  cycle: { observingStart: string; observingEnd: string },
  longitudeDeg: number,
) {
  const raDeg = round2(wrap360(raTransitingAtMidnight(middleNight(cycle), longitudeDeg) + 15 * t.raOffsetH));
  const first = Date.parse(`${cycle.observingStart}T00:00:00Z`);
  const iso = (days: number) => new Date(first + days * DAY_MS).toISOString().replace(".000Z", "Z");
  return {
    name: t.name,
    raDeg,
    decDeg: t.decDeg,
    model: t.model,
    magnitudes: t.magnitudes,
    minElevationDeg: t.minElevationDeg,
    notes: t.notes ?? "",
    timeWindows: (t.timeWindows ?? []).map((w) => ({
      startUtc: iso(w.startDay),
      endUtc: iso(w.endDay),
      ...(w.note ? { note: w.note } : {}),
    })),
    calibrators: (t.calibrators ?? []).map(({ dRaDeg, dDecDeg, ...c }) => ({
      ...c,
      raDeg: round2(wrap360(raDeg + dRaDeg)),
      decDeg: round2(t.decDeg + dDecDeg),
    })),
  };
}

/** When a demo proposal was submitted: before its cycle's deadline, and never after two days ago. */
export function demoSubmittedAt(demo: DemoProposal, deadline: Date, today: Date): Date {
  const byDeadline = deadline.getTime() - (demo.submittedDaysBeforeDeadline ?? 1) * DAY_MS;
  return new Date(
    Math.min(byDeadline, today.getTime() - 2 * DAY_MS - (demo.submittedDaysBeforeDeadline ?? 0) * 3_600_000),
  );
}

/** Writes the demo proposals of one cycle that are missing; returns how many of the list the cycle holds. */
export async function ensureDemoProposals(
  db: Database,
  {
    cycleId,
    list,
    longitudeDeg,
    today,
  }: { cycleId: number; list: readonly DemoProposal[]; longitudeDeg: number; today: Date },
) {
  let count = 0;
  for (const demo of list) {
    await ensureDemoProposal(db, { cycleId, demo, longitudeDeg, today });
    count++;
  }
  return count;
}

async function ensureDemoProposal(
  db: Database,
  { cycleId, demo, longitudeDeg, today }: { cycleId: number; demo: DemoProposal; longitudeDeg: number; today: Date },
) {
  await db.transaction(async (tx) => {
    const [pi] = await tx.select().from(users).where(sql`lower(${users.email}) = lower(${demo.pi})`);
    if (!pi) throw new Error(`demo proposal "${demo.title}": no demo person ${demo.pi}`);
    const [existing] = await tx
      .select({ id: proposals.id })
      .from(proposals)
      .where(and(eq(proposals.cycleId, cycleId), eq(proposals.piId, pi.id), eq(proposals.title, demo.title)));
    if (existing) return;
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
    const submittedAt = demoSubmittedAt(demo, cycle.submissionDeadline, today);
    const [band] = await tx
      .select({ id: bands.id, instrumentId: bands.instrumentId })
      .from(bands)
      .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
      .where(and(eq(instruments.name, demo.instrument), eq(bands.name, demo.band)));
    if (!band) throw new Error(`demo proposal "${demo.title}": no band ${demo.instrument} ${demo.band}`);
    const created = new Date(
      demo.status === "draft" ? today.getTime() - 10 * DAY_MS : submittedAt.getTime() - 3 * DAY_MS,
    );
    const [proposal] = await tx
      .insert(proposals)
      .values({
        cycleId,
        piId: pi.id,
        title: demo.title,
        abstract: demo.abstract,
        scienceCategory: demo.scienceCategory,
        instrumentId: band.instrumentId,
        bandId: band.id,
        createdAt: created,
        updatedAt: created,
      })
      .returning();
    for (const email of demo.coInvestigators) {
      const [account] = await tx
        .select({ id: users.id })
        .from(users)
        .where(sql`lower(${users.email}) = lower(${email})`);
      await tx
        .insert(proposalMembers)
        .values({ proposalId: proposal.id, email, userId: account?.id ?? null, invitedAt: created });
    }
    for (const [configurationName, hours] of Object.entries(demo.hours)) {
      const [config] = await tx
        .select({ id: configurations.id })
        .from(configurations)
        .where(eq(configurations.name, configurationName));
      if (!config) throw new Error(`demo proposal "${demo.title}": no configuration ${configurationName}`);
      await tx.insert(proposalHours).values({ proposalId: proposal.id, configurationId: config.id, hours });
    }
    for (const [position, t] of demo.targets.entries()) {
      const fields = targetFieldsOf(placeTarget(t, cycle, longitudeDeg));
      await tx.insert(proposalTargets).values({ proposalId: proposal.id, position, ...fields });
    }
    if (demo.pdf) {
      const bytes = makeTinyPdf([
        demo.title,
        "Science case (demonstration copy)",
        `PI: ${pi.name}, ${pi.institute}`,
        `Targets: ${demo.targets.map((t) => t.name).join(", ")}`,
        "Invented for the Fringe Docket demonstration; not a real proposal.",
      ]);
      await tx.insert(proposalDocuments).values({
        proposalId: proposal.id,
        filename: `${demo.title
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, "-")
          .replace(/^-|-$/g, "")}.pdf`,
        contentType: "application/pdf",
        sizeBytes: bytes.length,
        sha256: sha256Hex(bytes),
        data: Buffer.from(bytes),
        uploadedById: pi.id,
        uploadedAt: created,
      });
    }
    if (demo.status !== "draft") {
      const [locked] = await tx.select().from(proposals).where(eq(proposals.id, proposal.id)).for("update");
      await freezeVersion(tx, { proposal: locked, cycle, submittedById: pi.id, now: submittedAt });
      if (demo.status !== "submitted") {
        await tx
          .update(proposals)
          .set({ status: demo.status, updatedAt: submittedAt })
          .where(eq(proposals.id, proposal.id));
      }
    }
  });
}
