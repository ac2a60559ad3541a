/**
 * The Calibrator shortlist pages through their loaders and actions: settings read from the address with
 * field messages for bad ones, the proposal's defaults, "Add as calibrator" with its refusals, and the
 * name lookup where targets are typed (My targets form, proposal target form, CSV import by name).
 */
import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { catalogueStars } from "~/db/schema/catalogue";
import { proposals, proposalTargets, targets } from "~/db/schema/proposals";
import { DEMO_CONFIGURATIONS, DEMO_STATIONS } from "~/db/seed/scenario";
import {
  action as proposalShortlistAction,
  loader as proposalShortlistLoader,
} from "~/routes/catalogue/proposal-shortlist";
import { loader as shortlistLoader } from "~/routes/catalogue/shortlist";
import { action as importAction } from "~/routes/targets/import";
import { action as createTargetAction } from "~/routes/targets/index";
import {
  addTarget,
  cookie,
  editor,
  get,
  newDraft,
  run,
  saveText,
  useProposalWorld,
  userId,
  world,
} from "../proposals/fixture";

useProposalWorld();

/** The generic page's loader for a query string, as a signed-in proposer. */
async function shortlistPage(query: string, key = "ines") {
  const out = await run(() => shortlistLoader(get(`/catalogue/calibrators?${query}`, key)));
  return out;
}

/** The longest station-to-station distance of a demo configuration, metres (computed here). */
function demoLongestBaseline(name: string): number {
  const config = DEMO_CONFIGURATIONS.find((c) => c.name === name)!;
  const st = config.stations.map((s) => DEMO_STATIONS.find((d) => d.name === s)!);
  let best = 0;
  for (const a of st)
    for (const b of st) best = Math.max(best, Math.hypot(a.eastM - b.eastM, a.northM - b.northM, a.upM - b.upM));
  return best;
}

describe("the Calibrator shortlist page", () => {
  it("shows the settings and no list until a target is given", async () => {
    const out = await shortlistPage("");
    expect(out.status).toBe(200);
    expect(out.data.run).toBeNull();
    expect(out.data.values.date).toBe(new Date().toISOString().slice(0, 10));
  });

  it("lists calibrators for a star by name, on the configuration with the longest baseline by default", async () => {
    const out = await shortlistPage("target=alf+Ori&date=2027-01-10");
    expect(out.status).toBe(200);
    const { run: r } = out.data;
    expect(r.errors).toEqual({});
    expect(r.result.target).toMatchObject({ name: "Betelgeuse", hip: 27989 });
    expect(r.result.calibrators.length).toBeGreaterThan(0);
    expect(r.asked.configuration.name).toBe("extended-6");
    expect(r.asked.configuration.longestBaselineM).toBeCloseTo(demoLongestBaseline("extended-6"), 6);
    // The V² is computed on that baseline to 0.1 m.
    expect(Math.abs(r.asked.baselineM - demoLongestBaseline("extended-6"))).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(r.result.band.name).toBe("H");
  });

  it("takes typed coordinates and a typed baseline when no configuration is picked", async () => {
    const out = await shortlistPage("ra=05:55:10.3&dec=%2B07:24:25&config=&baseline=100&date=2027-01-10");
    expect(out.status).toBe(200);
    expect(out.data.run.asked).toMatchObject({ baselineM: 100, configuration: null });
    expect(out.data.run.result.target.hip).toBe(27989);
  });

  it("names the field of each bad setting and keeps what was typed", async () => {
    const bad = await shortlistPage("target=Vega&maxDistance=100&minVis2=2&date=2027-02-30&limit=0");
    expect(bad.status).toBe(400);
    expect(bad.data.run.errors).toEqual({
      maxDistance: "Within: degrees, above 0 and up to 90",
      minVis2: "Smallest V²: from 0 to 1",
      date: "Night of: not a real date",
      limit: "Entries: a whole number from 1 to 100",
    });
    expect(bad.data.values).toMatchObject({ target: "Vega", maxDistance: "100", date: "2027-02-30" });

    const unknown = await shortlistPage("target=Zorgon+Prime&date=2027-01-10");
    expect(unknown.status).toBe(400);
    expect(unknown.data.run.errors.target).toMatch(/^Target: no star called "Zorgon Prime".*type its coordinates/);
    expect(unknown.data.values.target).toBe("Zorgon Prime");

    const ra = await shortlistPage("ra=25:00:00&dec=0&date=2027-01-10");
    expect(ra.data.run.errors.ra).toMatch(/^Right ascension: hours must be from 0 to 23/);

    const noBaseline = await shortlistPage("target=Vega&config=&baseline=&date=2027-01-10");
    expect(noBaseline.data.run.errors.baseline).toMatch(/^Longest baseline: pick a configuration or type/);
    const wrongBand = await shortlistPage("target=Vega&band=999999&date=2027-01-10");
    expect(wrongBand.data.run.errors.band).toBe("Band: pick one from the list");
    const text = await shortlistPage("target=Vega&baseline=abc&config=&date=2027-01-10");
    expect(text.data.run.errors.baseline).toMatch(/^Longest baseline: not a number/);
  });

  it("is for signed-in people only", async () => {
    const out = await run(() => shortlistLoader(get("/catalogue/calibrators?target=Vega", null)));
    expect(out.status).toBe(302);
    expect(out.location).toMatch(/^\/sign-in/);
  });
});

/** A draft of Inés in the H band with hours on extended-6 and one target; returns the ids. */
async function draftWithTarget(title: string) {
  const id = await newDraft("ines", title);
  expect((await saveText(id, "ines", { title, bandId: String(world.bandH) })).status).toBe(302);
  const c = world.configId["extended-6"];
  expect(
    (await editor(id, "ines", { intent: "hours", [`hours-${c}`]: "4", [`label-${c}`]: "extended-6" })).status,
  ).toBe(302);
  // An invented target at a plausible position (near η Car's sky, up in March at latitude −31.4°).
  const t = await addTarget(id, "ines", { name: "Cerro Ardiente 7", ra: "10:45:00", dec: "-59:40:00", mag_H: "4.2" });
  expect(t.status).toBe(302);
  const [row] = await testDb().select().from(proposalTargets).where(eq(proposalTargets.proposalId, id));
  return { proposalId: String(id), targetId: String(row.id) };
}

const shortlistOf = (params: { proposalId: string; targetId: string }, key = "ines", query = "") =>
  run(() =>
    proposalShortlistLoader(
      get(`/catalogue/proposals/${params.proposalId}/targets/${params.targetId}/calibrators${query}`, key, params),
    ),
  );
const addOne = (params: { proposalId: string; targetId: string }, hip: string, key = "ines", query = "") =>
  run(() =>
    proposalShortlistAction(
      routeArgs(`/catalogue/proposals/${params.proposalId}/targets/${params.targetId}/calibrators${query}`, {
        ...formPost({ hip }, { Cookie: cookie[key] }),
        params,
      }),
    ),
  );
const calibratorsOf = async (targetId: string) =>
  (
    await testDb()
      .select()
      .from(proposalTargets)
      .where(eq(proposalTargets.id, Number(targetId)))
  )[0].calibrators;

describe("the shortlist of a proposal's target", () => {
  it("starts from the proposal's band, longest requested configuration, the cycle's best night and the target's H", async () => {
    const ids = await draftWithTarget("Shortlist defaults");
    const out = await shortlistOf(ids);
    expect(out.status).toBe(200);
    const page = out.data;
    expect(page.values.band).toBe(String(world.bandH));
    expect(page.values.config).toBe(String(world.configId["extended-6"]));
    // The T-open cycle observes 2027-03-01 … 2027-08-31; RA 10h45m transits at local midnight when the Sun
    // is 12 h of RA away (RA 22h45m), in mid-February (common practice): the first nights of the period are best.
    expect(page.values.date >= "2027-03-01" && page.values.date <= "2027-03-05").toBe(true);
    expect(page.run.result.target).toMatchObject({ bandMag: 4.2, bandMagSource: "request" });
    expect(page.run.result.calibrators.length).toBeGreaterThan(0);
    expect(page.editable).toBe(true);
    expect(page.added).toEqual([]);
  });

  it("adds a listed star as a calibrator with its catalogue position and estimates, once", async () => {
    const ids = await draftWithTarget("Shortlist add");
    const first = (await shortlistOf(ids)).data.run.result.calibrators[0];
    const query = "?minVis2=0.9";
    const done = await addOne(ids, String(first.hip), "ines", query);
    expect(done.status).toBe(302);
    expect(done.location).toBe(`/catalogue/proposals/${ids.proposalId}/targets/${ids.targetId}/calibrators${query}`);
    const [star] = await testDb().select().from(catalogueStars).where(eq(catalogueStars.hip, first.hip));
    const [cal] = await calibratorsOf(ids.targetId);
    expect(cal).toEqual({
      name: star.name,
      raDeg: star.raDeg,
      decDeg: star.decDeg,
      hip: first.hip,
      diameterMas: first.diameterMas,
      magnitude: first.bandMag,
    });
    expect((await shortlistOf(ids)).data.added).toEqual([first.hip]);

    const again = await addOne(ids, String(first.hip));
    expect(again.status).toBe(400);
    expect(again.data.error).toMatch(/is already a calibrator of Cerro Ardiente 7/);
    expect(await calibratorsOf(ids.targetId)).toHaveLength(1);
  });

  it("keeps a calibrator's catalogue number when the target form is saved again", async () => {
    const ids = await draftWithTarget("Shortlist keeps hip");
    const first = (await shortlistOf(ids)).data.run.result.calibrators[0];
    expect((await addOne(ids, String(first.hip))).status).toBe(302);
    const [cal] = await calibratorsOf(ids.targetId);
    const { action } = await import("~/routes/proposals/target");
    const saved = await run(() =>
      action(
        routeArgs(`/proposals/${ids.proposalId}/targets/${ids.targetId}`, {
          ...formPost(
            {
              name: "Cerro Ardiente 7",
              ra: "10:45:00",
              dec: "-59:40:00",
              model: "point",
              calName: cal.name,
              calRa: String(cal.raDeg),
              calDec: String(cal.decDeg),
              calDiameter: String(cal.diameterMas),
              calMagnitude: String(cal.magnitude),
              calHip: String(cal.hip),
            },
            { Cookie: cookie.ines },
          ),
          params: ids,
        }),
      ),
    );
    expect(saved.status).toBe(302);
    expect((await calibratorsOf(ids.targetId))[0].hip).toBe(first.hip);
  });

  it("refuses a bad star number, an unknown one, a full list, and a proposal that is no longer a draft", async () => {
    const ids = await draftWithTarget("Shortlist refusals");
    expect((await addOne(ids, "abc")).data.error).toBe("Star: pick one from the shortlist");
    const unknown = await addOne(ids, "9999999");
    expect(unknown.status).toBe(400);
    expect(unknown.data.error).toBe("Star: HIP 9999999 is not in the star catalogue.");

    const list = (await shortlistOf(ids, "ines", "?limit=12")).data.run.result.calibrators;
    for (const c of list.slice(0, 10)) expect((await addOne(ids, String(c.hip))).status).toBe(302);
    const full = await addOne(ids, String(list[10].hip));
    expect(full.status).toBe(400);
    expect(full.data.error).toMatch(/already has 10, the most a target may have/);

    await testDb()
      .update(proposals)
      .set({ status: "submitted" })
      .where(eq(proposals.id, Number(ids.proposalId)));
    const locked = await addOne(ids, String(list[11].hip));
    expect(locked.status).toBe(409);
    expect((await shortlistOf(ids)).data.editable).toBe(false);
  });

  it("is the same 404 for someone off the team, before anything they sent is read", async () => {
    const ids = await draftWithTarget("Shortlist privacy");
    expect((await shortlistOf(ids, "tomasz")).status).toBe(404);
    expect((await addOne(ids, "abc", "tomasz")).status).toBe(404);
    const other = await shortlistOf({ proposalId: ids.proposalId, targetId: "999999" });
    expect(other.status).toBe(404);
  });
});

describe("a target given by name alone", () => {
  const mine = (name: string) =>
    testDb()
      .select()
      .from(targets)
      .where(and(eq(targets.ownerId, userId.ines), eq(targets.name, name)));

  it("My targets: a star's name with no coordinates takes the star's position; any other name is refused", async () => {
    const post = (fields: Record<string, string>) =>
      settle(() =>
        createTargetAction(
          routeArgs("/targets", formPost({ intent: "create", model: "point", ...fields }, { Cookie: cookie.ines })),
        ),
      );
    expect((await post({ name: "58 Ori", ra: "", dec: "" })).status).toBe(302);
    const [row] = await mine("58 Ori");
    // stars.8.json, HIP 27989 (58 Ori = Betelgeuse): [88.7929, 7.4071].
    expect(row.raDeg).toBeCloseTo(88.7929, 4);
    expect(row.decDeg).toBeCloseTo(7.4071, 4);

    const refused = await post({ name: "Lumbre Nova 99", ra: "", dec: "" });
    expect(refused.status).toBe(400);
    const body = await refused.json();
    expect(body.errors.name).toMatch(/^Name: no coordinates given, and no star called "Lumbre Nova 99"/);
    expect(body.values.name).toBe("Lumbre Nova 99");
  });

  it("CSV import: rows with a name and no coordinates take the star's, and say so; an unknown name is a row error", async () => {
    const post = (csv: string, intent = "preview") =>
      run(() => importAction(routeArgs("/targets/import", formPost({ intent, csv }, { Cookie: cookie.ines }))));
    const preview = await post("name,model\nSirius,point\nalf Car,point\n");
    expect(preview.status).toBe(200);
    expect(preview.data.preview.errors).toEqual([]);
    expect(preview.data.preview.warnings).toEqual([
      "line 2: coordinates of Sirius (HIP 32349) from the star catalogue",
      "line 3: coordinates of Canopus (HIP 30438) from the star catalogue",
    ]);
    expect((await post("name,model\nSirius,point\nalf Car,point\n", "import")).status).toBe(302);
    const [sirius] = await mine("Sirius");
    // stars.8.json, HIP 32349: [101.2872, -16.7161].
    expect(sirius.raDeg).toBeCloseTo(101.2872, 4);
    expect(sirius.decDeg).toBeCloseTo(-16.7161, 4);

    const broken = await post("name,ra,dec\nZorgon Prime,,\nVega,18:36:56,\n");
    expect(broken.status).toBe(400);
    expect(broken.data.preview.errors).toEqual([
      { row: 2, column: "name", message: 'no coordinates given, and no star called "Zorgon Prime" to take them from' },
      { row: 3, column: "dec", message: "Declination: required (e.g. -01:12:07 or -1.2)" },
    ]);
  });
});
