import { testDb } from "@test/routes";
import { asc, eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import {
  PROPOSAL_STATUSES,
  proposalDocuments,
  proposalMembers,
  proposals,
  proposalVersions,
} from "~/db/schema/proposals";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { DEMO_PROPOSALS } from "~/db/seed/scenario";
import { checkPdf } from "~/services/proposals/pdf";
import { sha256Hex } from "~/services/proposals/science-case.server";
import type { ProposalSnapshot } from "~/services/proposals/versions.server";

describe("demo proposals in the seed", () => {
  it("writes a dozen proposals in every status, with frozen versions past draft, and is idempotent", async () => {
    const db = testDb();
    await seedDemoScenario(db);
    await seedDemoScenario(db);
    const rows = await db.select().from(proposals).orderBy(asc(proposals.id));
    expect(rows).toHaveLength(DEMO_PROPOSALS.length);
    expect(rows.length).toBeGreaterThanOrEqual(12);
    expect(new Set(rows.map((r) => r.status))).toEqual(new Set(PROPOSAL_STATUSES));

    for (const p of rows) {
      const versions = await db.select().from(proposalVersions).where(eq(proposalVersions.proposalId, p.id));
      if (p.status === "draft") {
        expect(versions).toHaveLength(0);
        expect(p.currentVersion).toBe(0);
        continue;
      }
      expect(versions).toHaveLength(1);
      expect(p.currentVersion).toBe(1);
      const [v] = versions;
      const snap = v.snapshot as unknown as ProposalSnapshot;
      expect(snap.title).toBe(p.title);
      expect(snap.feasibility.cells.length).toBe(snap.targets.length * snap.hours.length);
      expect(["pass", "caution", "fail"]).toContain(snap.feasibility.verdict);
      // The frozen PDF is a PDF by content and its recorded SHA-256 is that of the stored bytes.
      expect(v.documentData).not.toBeNull();
      expect(checkPdf(new Uint8Array(v.documentData!)).ok).toBe(true);
      expect(v.documentSha256).toBe(sha256Hex(new Uint8Array(v.documentData!)));
    }
    const [{ n }] = await db.select({ n: sql<number>`count(*)::int` }).from(proposalDocuments);
    expect(n).toBe(DEMO_PROPOSALS.filter((d) => d.pdf).length);
    // Invited co-investigators without an account stay unlinked until they sign up.
    const invited = await db
      .select()
      .from(proposalMembers)
      .where(eq(proposalMembers.email, "lucia.ferreyra@quebrada-obs.example"));
    expect(invited).toHaveLength(1);
    expect(invited[0].userId).toBeNull();
  });

  it("keeps the declined request's faint nucleus as a failed magnitude line", async () => {
    const db = testDb();
    await seedDemoScenario(db);
    const [p] = await db.select().from(proposals).where(eq(proposals.title, "The hot-dust core of Puna Lantern 8"));
    const [v] = await db.select().from(proposalVersions).where(eq(proposalVersions.proposalId, p.id));
    const snap = v.snapshot as unknown as ProposalSnapshot;
    // K = 9.6 against the K band's limit of 7.0 (demo registry).
    const magnitude = snap.feasibility.cells[0].lines.find((l) => l.check === "magnitude")!;
    expect(magnitude.verdict).toBe("fail");
    expect(magnitude.reason).toMatch(/fainter than the band's limit of 7\.0 mag/);
  });
});
