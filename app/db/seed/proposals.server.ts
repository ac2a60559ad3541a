/**
 * The demo proposals of app/db/seed/scenario.ts written into a cycle: idempotent by (cycle, PI,
 * title), so the seed can run again. Everything past draft gets version 1 frozen exactly as a
 * real submission would (snapshot, feasibility report computed by the engine, PDF bytes); the
 * seed writes no notices.
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
import type { DemoProposal } from "./scenario";

/** Writes the demo proposals that are missing; returns how many the cycle now holds from the list. */
export async function ensureDemoProposals(db: Database, cycleId: number, list: readonly DemoProposal[]) {
  let count = 0;
  for (const demo of list) {
    await ensureDemoProposal(db, cycleId, demo);
    count++;
  }
  return count;
}

async function ensureDemoProposal(db: Database, cycleId: number, demo: DemoProposal) {
  await db.transaction(async (tx) => {
    const [pi] = await tx.select().from(users).where(sql`lower(${users.email}) = lower(${demo.pi})`);
    if (!pi) throw new Error(`demo proposal "${demo.title}": no demo person ${demo.pi}`);
    const [existing] = await tx
      .select({ id: proposals.id })
      .from(proposals)
      .where(and(eq(proposals.cycleId, cycleId), eq(proposals.piId, pi.id), eq(proposals.title, demo.title)));
    if (existing) return;
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId));
    const [band] = await tx
      .select({ id: bands.id, instrumentId: bands.instrumentId })
      .from(bands)
      .innerJoin(instruments, eq(instruments.id, bands.instrumentId))
      .where(and(eq(instruments.name, demo.instrument), eq(bands.name, demo.band)));
    if (!band) throw new Error(`demo proposal "${demo.title}": no band ${demo.instrument} ${demo.band}`);
    const created = new Date(
      demo.submittedAt ? Date.parse(demo.submittedAt) - 3 * 86_400_000 : Date.parse("2026-11-20T10:00:00Z"),
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
      const fields = targetFieldsOf({ ...t, notes: t.notes ?? "" });
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
      const submittedAt = new Date(demo.submittedAt ?? "2026-11-20T12:00:00Z");
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
