/**
 * "Use this triangle" in the Triangle finder: a ranked triangle (its stations, and the site,
 * instrument, band and pool it was ranked for) is stored on a target of one of the person's drafts,
 * checked against the registry; the proposal's target page shows it. Anything else is a 4xx and
 * nothing is stored.
 */
import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { configurationStations, configurations, stations } from "~/db/schema/array";
import { cycles, proposals, proposalTargets } from "~/db/schema/proposals";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { loader as targetLoader } from "~/routes/proposals/target";
import { action as trianglesAction, loader as trianglesLoader } from "~/routes/sketch/triangles";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";
import { frozenProposal } from "~/services/committee/reading.server";
import { saveTarget, targetFieldsOf } from "~/services/proposals/targets.server";
import { freezeVersion } from "~/services/proposals/versions.server";

const SITE = "Sierra Lumbre Array";
let ines = "";
let scheduler = "";
let draftId = 0;
let targetId = 0;
let othersTarget = "";
let medium: string[] = [];
let outsider = "";

const session = async (email: string) => {
  const user = (await findUserByEmail(testDb(), email))!;
  return `fd_session=${(await createSession(testDb(), user.id, { method: "sso" })).token}`;
};
const firstTarget = async (title: string) => {
  const [p] = await testDb().select().from(proposals).where(eq(proposals.title, title));
  const [t] = await testDb()
    .select()
    .from(proposalTargets)
    .where(eq(proposalTargets.proposalId, p.id))
    .orderBy(asc(proposalTargets.position));
  return { proposalId: p.id, targetId: t.id };
};

beforeAll(async () => {
  await seedDemoScenario(testDb());
  ines = await session("ines.arroyo@valle-alto.example");
  scheduler = await session("mei.chao@sierra-lumbre.example");
  ({ proposalId: draftId, targetId } = await firstTarget("Limb darkening along the giant branch"));
  const others = await firstTarget("Periastron passage of Quebrada Twin 9");
  othersTarget = `${others.proposalId}:${others.targetId}`;
  const rows = await testDb()
    .select({ name: stations.name })
    .from(configurationStations)
    .innerJoin(configurations, eq(configurations.id, configurationStations.configurationId))
    .innerJoin(stations, eq(stations.id, configurationStations.stationId))
    .where(eq(configurations.name, "medium-4"))
    .orderBy(asc(configurationStations.position));
  medium = rows.map((r) => r.name);
  const all = await testDb().select({ name: stations.name }).from(stations);
  outsider = all.map((s) => s.name).find((n) => !medium.includes(n))!;
});

const use = (fields: Record<string, string>, cookie = ines) =>
  settle(() =>
    trianglesAction(routeArgs("/triangles", formPost({ intent: "use-triangle", ...fields }, { Cookie: cookie }))),
  );
const good = () => ({
  target: `${draftId}:${targetId}`,
  stations: medium.slice(0, 3).join(","),
  site: SITE,
  instrument: "Brasa",
  band: "H",
  pool: "medium-4",
});
const stored = async () =>
  (await testDb().select().from(proposalTargets).where(eq(proposalTargets.id, targetId)))[0].closureTriangle;

describe("Use this triangle", () => {
  it("offers the person's drafts with their targets", async () => {
    const page = await trianglesLoader(routeArgs("/triangles", { headers: { Cookie: ines } }));
    const draft = page.proposalTargets.find((p) => p.id === draftId)!;
    expect(draft.targets.map((t) => t.name)).toEqual(["Lumbre Nova 12", "Cerro Ardiente 7"]);
    expect(page.proposalTargets.map((p) => p.title)).not.toContain("Periastron passage of Quebrada Twin 9");
    const staff = await trianglesLoader(routeArgs("/triangles", { headers: { Cookie: scheduler } }));
    expect(staff.proposalTargets).toEqual([]);
  });

  it("refuses, with the field named and nothing stored, what does not match the registry", async () => {
    const cases: [Record<string, string>, number, RegExp][] = [
      [
        { stations: [medium[0], medium[1], outsider].join(",") },
        400,
        /^Stations: \S+ is not in configuration medium-4\.$/,
      ],
      [{ stations: [medium[0], medium[0], medium[1]].join(",") }, 400, /^Stations: the three must differ\.$/],
      [{ stations: medium.slice(0, 2).join(",") }, 400, /^Stations: give three\.$/],
      [{ instrument: "Nope" }, 400, /^Instrument: Sierra Lumbre Array has no instrument called Nope\.$/],
      [{ band: "Q" }, 400, /^Band: Brasa has no band called Q\.$/],
      [{ pool: "huge-9" }, 400, /^Pool: Sierra Lumbre Array has no configuration called huge-9\.$/],
      [{ site: "Elsewhere" }, 400, /^Site: there is no site called Elsewhere\.$/],
      [{ target: "" }, 400, /^Proposal target: choose one\.$/],
      [{ target: `${draftId}:999999` }, 400, /^Target: that target is not in the proposal/],
    ];
    for (const [change, status, message] of cases) {
      const res = await use({ ...good(), ...change });
      expect(res.status, JSON.stringify(change)).toBe(status);
      expect((await res.json()).triangleError).toMatch(message);
    }
    // Someone else's proposal is not revealed; a role without proposals of its own may not post.
    expect((await use({ ...good(), target: othersTarget })).status).toBe(404);
    expect((await use(good(), scheduler)).status).toBe(403);
    expect(await stored()).toBeNull();
  });

  it("stores the triangle on the target, and the proposal's target page shows it", async () => {
    const res = await use(good());
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe(`/proposals/${draftId}/targets/${targetId}`);
    expect(await stored()).toEqual({
      stations: medium.slice(0, 3),
      site: SITE,
      instrument: "Brasa",
      band: "H",
      configuration: "medium-4",
    });
    const page = await targetLoader(
      routeArgs(`/proposals/${draftId}/targets/${targetId}`, {
        headers: { Cookie: ines },
        params: { proposalId: String(draftId), targetId: String(targetId) },
      }),
    );
    expect(page.closureTriangle?.stations).toEqual(medium.slice(0, 3));

    // Ranked over every station: any three stations of the site; the new choice replaces the old.
    const wide = await use({ ...good(), stations: [outsider, medium[0], medium[3]].join(","), pool: "all" });
    expect(wide.status).toBe(302);
    expect(await stored()).toMatchObject({ stations: [outsider, medium[0], medium[3]], configuration: null });
  });

  it("keeps the triangle when the target's form is saved, and leaves the draft's other targets alone", async () => {
    const before = await stored();
    expect(before).not.toBeNull();
    const [row] = await testDb().select().from(proposalTargets).where(eq(proposalTargets.id, targetId));
    const user = (await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example"))!;
    const viewer = { user: { id: user.id, email: user.email }, roles: ["proposer" as const] };
    await saveTarget(testDb(), {
      viewer,
      proposalId: draftId,
      targetId,
      input: { ...targetFieldsOf(row), notes: "edited" },
    });
    expect(await stored()).toEqual(before);
    const all = await testDb().select().from(proposalTargets).where(eq(proposalTargets.proposalId, draftId));
    expect(all.find((t) => t.id === targetId)?.notes).toBe("edited");
    expect(all.filter((t) => t.id !== targetId).every((t) => t.closureTriangle === null)).toBe(true);
  });

  it("is frozen with the submitted version, and the committee's copy names it", async () => {
    const triangle = await stored();
    expect(triangle).not.toBeNull();
    const version = await testDb().transaction(async (tx) => {
      const [proposal] = await tx.select().from(proposals).where(eq(proposals.id, draftId));
      const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, proposal.cycleId));
      const user = (await findUserByEmail(tx, "ines.arroyo@valle-alto.example"))!;
      return freezeVersion(tx, { proposal, cycle, submittedById: user.id, now: new Date() });
    });
    const [row] = await testDb().select().from(proposalTargets).where(eq(proposalTargets.id, targetId));
    const frozen = version.snapshot.targets.find((t) => t.name === row.name);
    expect(frozen?.closureTriangle).toEqual(triangle);
    const read = await frozenProposal(testDb(), { proposalId: draftId, version: version.version });
    expect(read?.targets.find((t) => t.name === row.name)?.triangle).toBe(
      `Closure triangle ${triangle!.stations.join("–")} (ranked for Brasa H on every station at ${SITE})`,
    );
  });
});
