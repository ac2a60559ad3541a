/** Editing a draft: its text, hours and targets, and the deadline that ends it. */
import { testDb } from "@test/routes";
import { asc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { proposalHours, proposals, proposalTargets, targets } from "~/db/schema/proposals";
import { makeTinyPdf } from "~/services/proposals/pdf";
import * as fx from "./fixture";

fx.useProposalWorld();

/** A binary typed in with an elevation limit, a time window and a calibrator (blank rows left over). */
const ARDIENTE_BINARY = {
  name: "Cerro Ardiente 7",
  ra: "11:26:33.6",
  dec: "-28:03:00",
  model: "binary",
  separation_mas: "3.5",
  position_angle_deg: "112",
  flux_ratio: "0.55",
  mag_H: "4.4",
  minElevationDeg: "40",
  windowStart: ["2027-05-02T00:00", ""],
  windowEnd: ["2027-05-06T10:00", ""],
  windowNote: ["periastron", ""],
  calName: ["Ardiente Cal"],
  calRa: ["11:30:00"],
  calDec: ["-27:00:00"],
  calDiameter: ["0.3"],
  calMagnitude: [""],
  notes: "Binary with a 9-day orbit.",
};

describe("editing a draft", () => {
  it("saves the text; autosave answers with the time and saves only what passes validation", async () => {
    const id = await fx.newDraft("ines", "Autosave me");
    const saved = await fx.saveText(id, "ines", {
      title: "Autosaved",
      abstract: "Two words",
      scienceCategory: "Binary and multiple stars",
      bandId: String(fx.world.bandH),
    });
    expect(saved.status).toBe(302);
    expect(await fx.proposalRow(id)).toMatchObject({
      title: "Autosaved",
      abstract: "Two words",
      scienceCategory: "Binary and multiple stars",
      bandId: fx.world.bandH,
    });
    const auto = await fx.saveText(id, "ines", {
      intent: "autosave",
      title: "Autosaved again",
      abstract: "Three words here",
    });
    expect(auto.status).toBe(200);
    expect(Date.parse(auto.data.savedAt)).toBeGreaterThan(0);
    expect((await fx.proposalRow(id)).abstract).toBe("Three words here");
    const tooLong = Array.from({ length: 301 }, (_, i) => `w${i}`).join(" ");
    const refused = await fx.saveText(id, "ines", {
      intent: "autosave",
      abstract: tooLong,
      scienceCategory: "Astrology",
      bandId: "x",
    });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.data.errors).sort()).toEqual(["abstract", "bandId", "scienceCategory", "title"]);
    expect(refused.data.errors.abstract).toBe("Abstract: at most 300 words.");
    expect(refused.data.values.abstract).toBe(tooLong);
    expect(await fx.proposalRow(id)).toMatchObject({ title: "Autosaved again", abstract: "Three words here" });
  });

  it("answers odd bodies with 4xx, never 500: JSON, a title over two lines, a broken multipart body", async () => {
    const id = await fx.newDraft("ines", "Odd bodies");
    // A content type the form cannot read is 415 (docs/security.md, "Requests").
    const json = await fx.rawPost(id, "ines", { body: "{}", headers: { "Content-Type": "application/json" } });
    expect(json.status).toBe(415);
    const twoLines = await fx.saveText(id, "ines", { title: "One\nTwo" });
    expect(twoLines.status).toBe(400);
    expect(twoLines.data.errors.title).toBe("Title: must be a single line.");
    const broken = await fx.rawPost(id, "ines", {
      body: '--x\r\nContent-Disposition: form-data; name="intent"\r\n\r\nupload-document\r\n--x',
      headers: { "Content-Type": "multipart/form-data; boundary=zzz" },
    });
    expect(broken.status).toBe(400);
    expect(broken.data.errors.document).toMatch(/^Science case:/);
  });

  it("refuses a band that does not exist", async () => {
    const id = await fx.newDraft("ines", "Band check");
    const out = await fx.saveText(id, "ines", { title: "Band check", bandId: "999999" });
    expect(out.status).toBe(400);
    expect(out.data.errors.bandId).toMatch(/^Instrument and band:/);
  });

  it("saves hours per offered configuration and names the bad ones", async () => {
    const id = await fx.newDraft("ines", "Hours check");
    const c = fx.world.configId["compact-3"];
    const e = fx.world.configId["extended-6"];
    const m = fx.world.configId["medium-4"];
    expect(
      (
        await fx.editor(id, "ines", {
          intent: "hours",
          [`hours-${c}`]: "12.5",
          [`hours-${e}`]: "",
          [`label-${c}`]: "compact-3",
        })
      ).status,
    ).toBe(302);
    expect(await testDb().select().from(proposalHours).where(eq(proposalHours.proposalId, id))).toEqual([
      { proposalId: id, configurationId: c, hours: 12.5 },
    ]);
    const bad = await fx.editor(id, "ines", {
      intent: "hours",
      [`hours-${c}`]: "-3",
      [`hours-${e}`]: "250",
      [`label-${c}`]: "compact-3",
      [`label-${e}`]: "extended-6",
    });
    expect(bad.status).toBe(400);
    expect(bad.data.errors[`hours-${c}`]).toMatch(/^Hours for compact-3: must be more than 0 h/);
    expect(bad.data.errors[`hours-${e}`]).toBe("Hours for extended-6: must be at most 200 h.");
    expect(bad.data.values[`hours-${e}`]).toBe("250");
    const words = await fx.editor(id, "ines", { intent: "hours", [`hours-${c}`]: "ten", [`label-${c}`]: "compact-3" });
    expect(words.data.errors[`hours-${c}`]).toBe("Hours for compact-3: must be a number of hours.");
    // medium-4 is not on offer in this cycle.
    const notOffered = await fx.editor(id, "ines", { intent: "hours", [`hours-${m}`]: "4" });
    expect(notOffered.status).toBe(400);
    expect(notOffered.data.errors[`hours-${m}`]).toMatch(/not on offer/);
    expect(await testDb().select().from(proposalHours).where(eq(proposalHours.proposalId, id))).toEqual([
      { proposalId: id, configurationId: c, hours: 12.5 },
    ]);
  });

  it("adds a typed target with constraints and calibrators, and names every bad field", async () => {
    const id = await fx.newDraft("ines", "Target check");
    const ok = await fx.addTarget(id, "ines", ARDIENTE_BINARY);
    expect(ok.status).toBe(302);
    const [t] = await testDb().select().from(proposalTargets).where(eq(proposalTargets.proposalId, id));
    // 11h26m33.6s × 15°/h = 171.64° (common practice).
    expect(t.raDeg).toBeCloseTo(171.64, 6);
    expect(t.decDeg).toBeCloseTo(-28.05, 6);
    expect(t.model).toEqual({ type: "binary", separationMas: 3.5, positionAngleDeg: 112, fluxRatio: 0.55 });
    expect(t.minElevationDeg).toBe(40);
    expect(t.timeWindows).toEqual([
      { startUtc: "2027-05-02T00:00:00Z", endUtc: "2027-05-06T10:00:00Z", note: "periastron" },
    ]);
    expect(t.calibrators).toEqual([{ name: "Ardiente Cal", raDeg: 172.5, decDeg: -27, diameterMas: 0.3 }]);

    const bad = await fx.addTarget(id, "ines", {
      name: "Broken",
      ra: "25:00:00",
      dec: "-28",
      model: "uniformDisk",
      size_mas: "-1",
      minElevationDeg: "10",
      windowStart: ["2027-05-06T10:00"],
      windowEnd: ["2027-05-02T00:00"],
      windowNote: [""],
      calName: [""],
      calRa: ["11:30:00"],
      calDec: ["-27"],
      calDiameter: [""],
      calMagnitude: [""],
    });
    expect(bad.status).toBe(400);
    expect(bad.data.errors.ra).toMatch(/^Right ascension/);
    expect(bad.data.errors.size_mas).toMatch(/^Size/);
    expect(bad.data.errors.minElevationDeg).toBe(
      "Minimum elevation: the array does not observe below 30°; leave it empty to use that limit.",
    );
    expect(bad.data.errors["window-0"]).toBe("Time window 1: the end must be after the start.");
    expect(bad.data.errors["calibrator-0"]).toBe("Calibrator 1: a name is required.");
    expect(bad.data.values.ra).toBe("25:00:00");
    expect(bad.data.windows).toEqual([{ start: "2027-05-06T10:00", end: "2027-05-02T00:00", note: "" }]);
    expect(await testDb().select().from(proposalTargets).where(eq(proposalTargets.proposalId, id))).toHaveLength(1);

    const dup = await fx.addTarget(id, "ines", { name: "cerro ardiente 7", ra: "1", dec: "1", model: "point" });
    expect(dup.status).toBe(400);
    expect(dup.data.errors.name).toMatch(/already has a target called/);
  });

  it("copies one of my own targets, but not someone else's, then reorders and removes", async () => {
    const db = testDb();
    const id = await fx.newDraft("ines", "Copy check");
    const [mine] = await db
      .insert(targets)
      .values({
        ownerId: fx.userId.ines,
        name: "Pampa Kite 3",
        raDeg: 164.12,
        decDeg: -45.6,
        model: { type: "uniformDisk", diameterMas: 0.9 },
        magnitudes: { H: 4.8 },
      })
      .returning();
    const [theirs] = await db
      .insert(targets)
      .values({ ownerId: fx.userId.amara, name: "Not yours", raDeg: 10, decDeg: -10, model: { type: "point" } })
      .returning();
    expect(
      (await fx.editor(id, "ines", { intent: "add-my-target", myTargetId: String(theirs.id) })).data.errors.myTargetId,
    ).toMatch(/your own targets/);
    expect((await fx.editor(id, "ines", { intent: "add-my-target", myTargetId: String(mine.id) })).status).toBe(302);
    await fx.addTarget(id, "ines", { name: "Second", ra: "12:00:00", dec: "-30", model: "point" });
    const order = async () =>
      (
        await db
          .select()
          .from(proposalTargets)
          .where(eq(proposalTargets.proposalId, id))
          .orderBy(asc(proposalTargets.position))
      ).map((t) => t.name);
    expect(await order()).toEqual(["Pampa Kite 3", "Second"]);
    const [, second] = await db
      .select()
      .from(proposalTargets)
      .where(eq(proposalTargets.proposalId, id))
      .orderBy(asc(proposalTargets.position));
    expect(
      (await fx.editor(id, "ines", { intent: "move-target", targetId: String(second.id), direction: "up" })).status,
    ).toBe(302);
    expect(await order()).toEqual(["Second", "Pampa Kite 3"]);
    expect((await fx.editor(id, "ines", { intent: "remove-target", targetId: String(second.id) })).status).toBe(302);
    expect(await order()).toEqual(["Pampa Kite 3"]);
    const [copied] = await db.select().from(proposalTargets).where(eq(proposalTargets.proposalId, id));
    expect(copied).toMatchObject({
      sourceTargetId: mine.id,
      raDeg: 164.12,
      model: { type: "uniformDisk", diameterMas: 0.9 },
      magnitudes: { H: 4.8 },
    });
  });

  it("refuses every change to a draft whose cycle's deadline has passed", async () => {
    const [late] = await testDb()
      .insert(proposals)
      .values({ cycleId: fx.world.closedCycleId, piId: fx.userId.ines, title: "Late draft" })
      .returning();
    const out = await fx.saveText(late.id, "ines", { title: "Changed" });
    expect(out.status).toBe(409);
    expect(out.data.errors.form).toMatch(/T-closed deadline .* has passed/);
    expect((await fx.editor(late.id, "ines", { intent: "submit", confirm: "yes" })).data.errors.form).toMatch(
      /^Too late: the T-closed deadline \(\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\) has passed/,
    );
    expect((await fx.upload(late.id, "ines", makeTinyPdf(["late"]), "late.pdf")).status).toBe(409);
    const target = await fx.addTarget(late.id, "ines", { name: "X", ra: "1", dec: "1", model: "point" });
    expect(target.status).toBe(409);
    expect((await fx.proposalRow(late.id)).title).toBe("Late draft");
  });
});
