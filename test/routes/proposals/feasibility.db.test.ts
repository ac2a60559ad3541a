/** The feasibility page of a draft, and the target pages of a proposal. */
import { testDb } from "@test/routes";
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { proposalTargets } from "~/db/schema/proposals";
import { loader as feasibilityLoader } from "~/routes/proposals/feasibility";
import { loader as targetLoader } from "~/routes/proposals/target";
import type { FeasibilityReport } from "~/services/proposals/feasibility";
import * as fx from "./fixture";

fx.useProposalWorld();

describe("the feasibility page", () => {
  it("computes a draft's report for each target × requested configuration", async () => {
    const id = await fx.completeDraft("Feasible?");
    await fx.editor(id, "ines", {
      intent: "hours",
      [`hours-${fx.world.configId["compact-3"]}`]: "6",
      [`hours-${fx.world.configId["extended-6"]}`]: "4",
    });
    const out = await fx.run(() =>
      feasibilityLoader(fx.get(`/proposals/${id}/feasibility`, "ines", { proposalId: String(id) })),
    );
    expect(out.data.frozen).toBe(false);
    const report = (await out.data.report) as FeasibilityReport;
    expect(report.cells.map((c) => `${c.target}/${c.configuration}`)).toEqual([
      "Lumbre Nova 12/compact-3",
      "Lumbre Nova 12/extended-6",
    ]);
    expect(report.band).toBe("Brasa H");
    for (const c of report.cells) for (const l of c.lines) expect(l.reason.length).toBeGreaterThan(10);
  });

  it("refuses a target page for a target of another proposal", async () => {
    const a = await fx.completeDraft("Owner A");
    const b = await fx.newDraft("ines", "Owner B");
    const [t] = await testDb()
      .select()
      .from(proposalTargets)
      .where(and(eq(proposalTargets.proposalId, a)));
    const targetPage = (proposalId: number) =>
      fx.run(() =>
        targetLoader(
          fx.get(`/proposals/${proposalId}/targets/${t.id}`, "ines", {
            proposalId: String(proposalId),
            targetId: String(t.id),
          }),
        ),
      );
    expect((await targetPage(b)).status).toBe(404);
    expect((await targetPage(a)).status).toBe(200);
  });
});
