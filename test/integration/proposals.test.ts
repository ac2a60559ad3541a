import { formPost, routeArgs, testDb } from "@test/routes";
import { and, asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { configurations } from "~/db/schema/array";
import { outboxMessages } from "~/db/schema/mail";
import {
  proposalDocuments,
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
  proposalVersions,
  targets,
} from "~/db/schema/proposals";
import { ensureUser, seedDemoScenario } from "~/db/seed/factories.server";
import { action as editorAction, loader as editorLoader } from "~/routes/proposals/editor";
import { loader as feasibilityLoader } from "~/routes/proposals/feasibility";
import { loader as listLoader } from "~/routes/proposals/list";
import { action as newAction } from "~/routes/proposals/new";
import { loader as documentLoader } from "~/routes/proposals/science-case";
import { action as targetAction, loader as targetLoader } from "~/routes/proposals/target";
import { loader as versionLoader } from "~/routes/proposals/version";
import { createSession } from "~/services/auth/sessions.server";
import { createCycle } from "~/services/cycles/cycles.server";
import type { FeasibilityReport } from "~/services/proposals/feasibility";
import { MAX_PDF_BYTES, makeTinyPdf } from "~/services/proposals/pdf";
import type { ProposalSnapshot } from "~/services/proposals/proposals.server";
import { MAX_UPLOAD_BODY_BYTES } from "~/services/proposals/upload.server";

// ---------------------------------------------------------------- helpers

type Outcome = { status: number; location: string | null; data: any; headers: Headers | null; body: Uint8Array | null };

/** Runs a loader or action and says what it answered: status, redirect, data; returned or thrown. */
async function run(fn: () => unknown): Promise<Outcome> {
  let out: unknown;
  try {
    out = await fn();
  } catch (e) {
    out = e;
  }
  if (out instanceof Response) {
    const body = new Uint8Array(await out.arrayBuffer());
    let data: unknown = null;
    try {
      data = JSON.parse(Buffer.from(body).toString("utf8"));
    } catch {
      data = Buffer.from(body).toString("utf8");
    }
    return { status: out.status, location: out.headers.get("Location"), data, headers: out.headers, body };
  }
  if (typeof out === "object" && out !== null && (out as { type?: string }).type === "DataWithResponseInit") {
    const d = out as { data: unknown; init: ResponseInit | null };
    return { status: d.init?.status ?? 200, location: null, data: d.data, headers: null, body: null };
  }
  if (out instanceof Error) throw out;
  return { status: 200, location: null, data: out, headers: null, body: null };
}

const people = {
  ines: "ines.arroyo@valle-alto.example",
  tomasz: "tomasz.wierzbicki@baltic-stellar.example",
  amara: "amara.okafor@harmattan-obs.example",
  mei: "mei.chao@sierra-lumbre.example",
};
const cookie: Record<string, string> = {};
const userId: Record<string, number> = {};
let openCycleId = 0;
let closedCycleId = 0;
const configId: Record<string, number> = {};

async function signIn(key: string, email: string, roles?: ("proposer" | "scheduler")[]) {
  const user = await ensureUser(testDb(), { email, name: key, roles });
  const { token } = await createSession(testDb(), user.id, { method: "sso" });
  cookie[key] = `fd_session=${token}`;
  userId[key] = user.id;
}

const post = (path: string, key: string, fields: Record<string, string | string[]>, params: Record<string, string>) =>
  routeArgs(path, { ...formPost(fields, { Cookie: cookie[key] }), params });
const get = (path: string, key: string | null, params: Record<string, string> = {}) =>
  routeArgs(path, { headers: key ? { Cookie: cookie[key] } : {}, params });

async function newDraft(key = "ines", title = "Test proposal", cycleId = openCycleId) {
  const out = await run(() => newAction(post("/proposals/new", key, { cycleId: String(cycleId), title }, {})));
  expect(out.status).toBe(302);
  return Number(/\/proposals\/(\d+)$/.exec(out.location!)![1]);
}

const editor = (id: number, key: string, fields: Record<string, string | string[]>) =>
  run(() => editorAction(post(`/proposals/${id}`, key, fields, { proposalId: String(id) })));

async function upload(id: number, key: string, bytes: Uint8Array, filename: string, type = "application/pdf") {
  const form = new FormData();
  form.set("intent", "upload-document");
  form.set("document", new File([new Uint8Array(bytes)], filename, { type }));
  return run(() =>
    editorAction(
      routeArgs(`/proposals/${id}`, {
        method: "POST",
        body: form,
        headers: { Cookie: cookie[key] },
        params: { proposalId: String(id) },
      }),
    ),
  );
}

const proposalRow = async (id: number) => (await testDb().select().from(proposals).where(eq(proposals.id, id)))[0];

/** A proposal with everything submission needs, written through the actions. */
async function completeDraft(title = "Complete proposal") {
  const id = await newDraft("ines", title);
  expect(
    (
      await editor(id, "ines", {
        intent: "save",
        title,
        abstract: "We measure a diameter.",
        scienceCategory: "Stellar surfaces and diameters",
        bandId: String(bandH),
      })
    ).status,
  ).toBe(302);
  expect(
    (
      await editor(id, "ines", {
        intent: "hours",
        [`hours-${configId["compact-3"]}`]: "6",
        [`label-${configId["compact-3"]}`]: "compact-3",
      })
    ).status,
  ).toBe(302);
  const t = await run(() =>
    targetAction(
      post(
        `/proposals/${id}/targets/new`,
        "ines",
        { name: "Lumbre Nova 12", ra: "09:52:50", dec: "-41:22:12", model: "uniformDisk", size_mas: "3", mag_H: "3.1" },
        { proposalId: String(id), targetId: "new" },
      ),
    ),
  );
  expect(t.status).toBe(302);
  expect((await upload(id, "ines", makeTinyPdf(["Science case"]), "case.pdf")).status).toBe(302);
  return id;
}

let bandH = 0;

beforeAll(async () => {
  const db = testDb();
  await seedDemoScenario(db);
  for (const c of await db.select().from(configurations)) configId[c.name] = c.id;
  const { bands } = await import("~/db/schema/array");
  const [h] = await db.select().from(bands).where(eq(bands.name, "H"));
  bandH = h.id;
  const day = 86_400_000;
  // Deadlines relative to the clock, so the tests do not age.
  const open = await createCycle(
    db,
    {
      name: "T-open",
      description: "",
      observingStart: "2027-03-01",
      observingEnd: "2027-08-31",
      submissionDeadline: new Date(Date.now() + 30 * day),
      offers: [
        { configurationId: configId["compact-3"], nightsAvailable: 10 },
        { configurationId: configId["extended-6"], nightsAvailable: 10 },
      ],
    },
    null,
  );
  openCycleId = open.id;
  const closed = await createCycle(
    db,
    {
      name: "T-closed",
      description: "",
      observingStart: "2026-09-01",
      observingEnd: "2027-02-28",
      submissionDeadline: new Date(Date.now() - day),
      offers: [{ configurationId: configId["compact-3"], nightsAvailable: 10 }],
    },
    null,
  );
  closedCycleId = closed.id;
  await signIn("ines", people.ines);
  await signIn("tomasz", people.tomasz);
  await signIn("amara", people.amara);
  await signIn("mei", people.mei);
});

// ---------------------------------------------------------------- creating and listing

describe("starting a proposal", () => {
  it("creates a draft in an open cycle and lists it under My proposals", async () => {
    const id = await newDraft("ines", "Limb darkening of Lumbre Nova 12");
    const row = await proposalRow(id);
    expect(row).toMatchObject({
      status: "draft",
      piId: userId.ines,
      cycleId: openCycleId,
      title: "Limb darkening of Lumbre Nova 12",
    });
    const list = await run(() => listLoader(get("/proposals", "ines")));
    const mine = list.data.proposals.find((p: { id: number }) => p.id === id);
    expect(mine).toMatchObject({ role: "PI", statusLabel: "Draft", cycleName: "T-open" });
    expect(mine.countdown).toMatch(/days left/);
  });

  it("names the missing fields, keeps what was typed and writes nothing", async () => {
    const before = (await testDb().select().from(proposals)).length;
    const out = await run(() =>
      newAction(post("/proposals/new", "ines", { cycleId: String(openCycleId), title: "   " }, {})),
    );
    expect(out.status).toBe(400);
    expect(out.data.errors.title).toMatch(/^Title:/);
    expect(out.data.values.cycleId).toBe(String(openCycleId));
    const bad = await run(() =>
      newAction(post("/proposals/new", "ines", { cycleId: "abc", title: "x".repeat(201) }, {})),
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.data.errors).sort()).toEqual(["cycleId", "title"]);
    expect((await testDb().select().from(proposals)).length).toBe(before);
  });

  it("refuses a cycle whose deadline has passed, naming the deadline", async () => {
    const out = await run(() =>
      newAction(post("/proposals/new", "ines", { cycleId: String(closedCycleId), title: "Too late" }, {})),
    );
    expect(out.status).toBe(409);
    expect(out.data.errors.cycleId).toMatch(/T-closed deadline \(\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\) has passed/);
    expect(await testDb().select().from(proposals).where(eq(proposals.title, "Too late"))).toEqual([]);
  });

  it("keeps other roles out (403) and anonymous visitors at the sign-in page", async () => {
    expect((await run(() => listLoader(get("/proposals", "mei")))).status).toBe(403);
    expect(
      (await run(() => newAction(post("/proposals/new", "mei", { cycleId: String(openCycleId), title: "x" }, {}))))
        .status,
    ).toBe(403);
    const anon = await run(() => listLoader(get("/proposals", null)));
    expect(anon.status).toBe(302);
    expect(anon.location).toMatch(/^\/sign-in\?next=/);
  });
});

// ---------------------------------------------------------------- access

describe("who may see a proposal", () => {
  it("answers 404 to another proposer, for the page, every action and the download", async () => {
    const id = await newDraft("ines", "Private draft");
    const p = { proposalId: String(id) };
    expect((await run(() => editorLoader(get(`/proposals/${id}`, "amara", p)))).status).toBe(404);
    expect(
      (await editor(id, "amara", { intent: "save", title: "Mine now", abstract: "", scienceCategory: "", bandId: "" }))
        .status,
    ).toBe(404);
    expect((await run(() => feasibilityLoader(get(`/proposals/${id}/feasibility`, "amara", p)))).status).toBe(404);
    expect((await run(() => documentLoader(get(`/proposals/${id}/science-case`, "amara", p)))).status).toBe(404);
    expect((await upload(id, "amara", makeTinyPdf(["x"]), "x.pdf")).status).toBe(404);
    expect(
      (await run(() => targetLoader(get(`/proposals/${id}/targets/new`, "amara", { ...p, targetId: "new" })))).status,
    ).toBe(404);
    // A number that does not exist answers the same way.
    expect((await run(() => editorLoader(get("/proposals/999999", "amara", { proposalId: "999999" })))).status).toBe(
      404,
    );
    expect((await run(() => editorLoader(get("/proposals/abc", "amara", { proposalId: "abc" })))).status).toBe(404);
    expect((await proposalRow(id)).title).toBe("Private draft");
  });

  it("answers 403 to a scheduler before looking the proposal up", async () => {
    const id = await newDraft("ines", "Scheduler check");
    const p = { proposalId: String(id) };
    expect((await run(() => editorLoader(get(`/proposals/${id}`, "mei", p)))).status).toBe(403);
    expect((await editor(id, "mei", { intent: "submit" })).status).toBe(403);
    expect((await run(() => documentLoader(get(`/proposals/${id}/science-case`, "mei", p)))).status).toBe(403);
  });

  it("lets a co-investigator invited before signing up in, and links the account on first visit", async () => {
    const id = await newDraft("ines", "Team proposal");
    const added = await editor(id, "ines", { intent: "add-member", email: "New.Comer@Elsewhere.example" });
    expect(added.status).toBe(302);
    const [member] = await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id));
    expect(member.userId).toBeNull();
    // The notice went to the outbox in the same transaction.
    const mail = await testDb()
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.toAddress, "New.Comer@Elsewhere.example"));
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toBe('You are a co-investigator on "Team proposal"');
    expect(mail[0].text).toMatch(/Inés|ines/i);
    await signIn("newcomer", "new.comer@elsewhere.example", ["proposer"]);
    const list = await run(() => listLoader(get("/proposals", "newcomer")));
    expect(list.data.proposals.map((p: { id: number; role: string }) => [p.id, p.role])).toContainEqual([id, "Co-I"]);
    const page = await run(() => editorLoader(get(`/proposals/${id}`, "newcomer", { proposalId: String(id) })));
    expect(page.status).toBe(200);
    expect(page.data.abilities).toMatchObject({
      relation: "co-investigator",
      canEdit: true,
      canManageTeam: false,
      canWithdraw: false,
    });
    const [linked] = await testDb().select().from(proposalMembers).where(eq(proposalMembers.id, member.id));
    expect(linked.userId).toBe(userId.newcomer);
    // A co-investigator edits the text but does not change the team.
    expect(
      (
        await editor(id, "newcomer", {
          intent: "save",
          title: "Team proposal v2",
          abstract: "",
          scienceCategory: "",
          bandId: "",
        })
      ).status,
    ).toBe(302);
    const refused = await editor(id, "newcomer", { intent: "add-member", email: "third@elsewhere.example" });
    expect(refused.status).toBe(403);
    expect(refused.data.errors.form).toBe("Only the PI adds or removes co-investigators.");
  });

  it("refuses the PI's own address, a duplicate and a malformed address, naming the field", async () => {
    const id = await newDraft("ines", "Team checks");
    expect((await editor(id, "ines", { intent: "add-member", email: people.tomasz })).status).toBe(302);
    const dup = await editor(id, "ines", { intent: "add-member", email: people.tomasz.toUpperCase() });
    expect(dup.status).toBe(400);
    expect(dup.data.errors.email).toMatch(/already on the team/);
    const self = await editor(id, "ines", { intent: "add-member", email: people.ines });
    expect(self.data.errors.email).toMatch(/PI's own address/);
    const bad = await editor(id, "ines", { intent: "add-member", email: "not-an-address" });
    expect(bad.status).toBe(400);
    expect(bad.data.errors.email).toBe("Co-investigator e-mail: not an e-mail address.");
    expect(bad.data.values.email).toBe("not-an-address");
    expect(await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id))).toHaveLength(1);
    const [m] = await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id));
    expect((await editor(id, "ines", { intent: "remove-member", memberId: String(m.id) })).status).toBe(302);
    expect(await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id))).toHaveLength(0);
  });
});

// ---------------------------------------------------------------- editing

describe("editing a draft", () => {
  it("saves the text; autosave answers with the time and saves only what passes validation", async () => {
    const id = await newDraft("ines", "Autosave me");
    const saved = await editor(id, "ines", {
      intent: "save",
      title: "Autosaved",
      abstract: "Two words",
      scienceCategory: "Binary and multiple stars",
      bandId: String(bandH),
    });
    expect(saved.status).toBe(302);
    expect(await proposalRow(id)).toMatchObject({
      title: "Autosaved",
      abstract: "Two words",
      scienceCategory: "Binary and multiple stars",
      bandId: bandH,
    });
    const auto = await editor(id, "ines", {
      intent: "autosave",
      title: "Autosaved again",
      abstract: "Three words here",
      scienceCategory: "",
      bandId: "",
    });
    expect(auto.status).toBe(200);
    expect(Date.parse(auto.data.savedAt)).toBeGreaterThan(0);
    expect((await proposalRow(id)).abstract).toBe("Three words here");
    const tooLong = Array.from({ length: 301 }, (_, i) => `w${i}`).join(" ");
    const refused = await editor(id, "ines", {
      intent: "autosave",
      title: "",
      abstract: tooLong,
      scienceCategory: "Astrology",
      bandId: "x",
    });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.data.errors).sort()).toEqual(["abstract", "bandId", "scienceCategory", "title"]);
    expect(refused.data.errors.abstract).toBe("Abstract: at most 300 words.");
    expect(refused.data.values.abstract).toBe(tooLong);
    expect(await proposalRow(id)).toMatchObject({ title: "Autosaved again", abstract: "Three words here" });
  });

  it("answers odd bodies with 4xx, never 500: JSON, a title over two lines, a broken multipart body", async () => {
    const id = await newDraft("ines", "Odd bodies");
    const p = { proposalId: String(id) };
    const json = await run(() =>
      editorAction(
        routeArgs(`/proposals/${id}`, {
          method: "POST",
          body: "{}",
          headers: { Cookie: cookie.ines, "Content-Type": "application/json" },
          params: p,
        }),
      ),
    );
    expect(json.status).toBe(400);
    const twoLines = await editor(id, "ines", {
      intent: "save",
      title: "One\nTwo",
      abstract: "",
      scienceCategory: "",
      bandId: "",
    });
    expect(twoLines.status).toBe(400);
    expect(twoLines.data.errors.title).toBe("Title: must be a single line.");
    const broken = await run(() =>
      editorAction(
        routeArgs(`/proposals/${id}`, {
          method: "POST",
          body: '--x\r\nContent-Disposition: form-data; name="intent"\r\n\r\nupload-document\r\n--x',
          headers: { Cookie: cookie.ines, "Content-Type": "multipart/form-data; boundary=zzz" },
          params: p,
        }),
      ),
    );
    expect(broken.status).toBe(400);
    expect(broken.data.errors.document).toMatch(/^Science case:/);
  });

  it("refuses a band that does not exist", async () => {
    const id = await newDraft("ines", "Band check");
    const out = await editor(id, "ines", {
      intent: "save",
      title: "Band check",
      abstract: "",
      scienceCategory: "",
      bandId: "999999",
    });
    expect(out.status).toBe(400);
    expect(out.data.errors.bandId).toMatch(/^Instrument and band:/);
  });

  it("saves hours per offered configuration and names the bad ones", async () => {
    const id = await newDraft("ines", "Hours check");
    const c = configId["compact-3"];
    const e = configId["extended-6"];
    const m = configId["medium-4"];
    expect(
      (
        await editor(id, "ines", {
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
    const bad = await editor(id, "ines", {
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
    const words = await editor(id, "ines", { intent: "hours", [`hours-${c}`]: "ten", [`label-${c}`]: "compact-3" });
    expect(words.data.errors[`hours-${c}`]).toBe("Hours for compact-3: must be a number of hours.");
    // medium-4 is not on offer in this cycle.
    const notOffered = await editor(id, "ines", { intent: "hours", [`hours-${m}`]: "4" });
    expect(notOffered.status).toBe(400);
    expect(notOffered.data.errors[`hours-${m}`]).toMatch(/not on offer/);
    expect(await testDb().select().from(proposalHours).where(eq(proposalHours.proposalId, id))).toEqual([
      { proposalId: id, configurationId: c, hours: 12.5 },
    ]);
  });

  it("adds a typed target with constraints and calibrators, and names every bad field", async () => {
    const id = await newDraft("ines", "Target check");
    const p = { proposalId: String(id), targetId: "new" };
    const ok = await run(() =>
      targetAction(
        post(
          `/proposals/${id}/targets/new`,
          "ines",
          {
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
          },
          p,
        ),
      ),
    );
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

    const bad = await run(() =>
      targetAction(
        post(
          `/proposals/${id}/targets/new`,
          "ines",
          {
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
          },
          p,
        ),
      ),
    );
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

    const dup = await run(() =>
      targetAction(
        post(
          `/proposals/${id}/targets/new`,
          "ines",
          { name: "cerro ardiente 7", ra: "1", dec: "1", model: "point" },
          p,
        ),
      ),
    );
    expect(dup.status).toBe(400);
    expect(dup.data.errors.name).toMatch(/already has a target called/);
  });

  it("copies one of my own targets, but not someone else's, then reorders and removes", async () => {
    const db = testDb();
    const id = await newDraft("ines", "Copy check");
    const [mine] = await db
      .insert(targets)
      .values({
        ownerId: userId.ines,
        name: "Pampa Kite 3",
        raDeg: 164.12,
        decDeg: -45.6,
        model: { type: "uniformDisk", diameterMas: 0.9 },
        magnitudes: { H: 4.8 },
      })
      .returning();
    const [theirs] = await db
      .insert(targets)
      .values({ ownerId: userId.amara, name: "Not yours", raDeg: 10, decDeg: -10, model: { type: "point" } })
      .returning();
    expect(
      (await editor(id, "ines", { intent: "add-my-target", myTargetId: String(theirs.id) })).data.errors.myTargetId,
    ).toMatch(/your own targets/);
    expect((await editor(id, "ines", { intent: "add-my-target", myTargetId: String(mine.id) })).status).toBe(302);
    await run(() =>
      targetAction(
        post(
          `/proposals/${id}/targets/new`,
          "ines",
          { name: "Second", ra: "12:00:00", dec: "-30", model: "point" },
          { proposalId: String(id), targetId: "new" },
        ),
      ),
    );
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
      (await editor(id, "ines", { intent: "move-target", targetId: String(second.id), direction: "up" })).status,
    ).toBe(302);
    expect(await order()).toEqual(["Second", "Pampa Kite 3"]);
    expect((await editor(id, "ines", { intent: "remove-target", targetId: String(second.id) })).status).toBe(302);
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
      .values({ cycleId: closedCycleId, piId: userId.ines, title: "Late draft" })
      .returning();
    const out = await editor(late.id, "ines", {
      intent: "save",
      title: "Changed",
      abstract: "",
      scienceCategory: "",
      bandId: "",
    });
    expect(out.status).toBe(409);
    expect(out.data.errors.form).toMatch(/T-closed deadline .* has passed/);
    expect((await editor(late.id, "ines", { intent: "submit" })).data.errors.form).toMatch(
      /^Too late: the T-closed deadline \(\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\) has passed/,
    );
    expect((await upload(late.id, "ines", makeTinyPdf(["late"]), "late.pdf")).status).toBe(409);
    const target = await run(() =>
      targetAction(
        post(
          `/proposals/${late.id}/targets/new`,
          "ines",
          { name: "X", ra: "1", dec: "1", model: "point" },
          { proposalId: String(late.id), targetId: "new" },
        ),
      ),
    );
    expect(target.status).toBe(409);
    expect((await proposalRow(late.id)).title).toBe("Late draft");
  });
});

// ---------------------------------------------------------------- the science case

describe("the PDF science case", () => {
  it("stores a real PDF and serves it only to the team, as an attachment", async () => {
    const id = await newDraft("ines", "PDF check");
    await editor(id, "ines", { intent: "add-member", email: people.tomasz });
    const pdf = makeTinyPdf(["PDF check", "science case"]);
    const up = await upload(id, "ines", pdf, "../../etc/My Case.PDF", "text/plain");
    expect(up.status).toBe(302);
    const [doc] = await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id));
    expect(doc).toMatchObject({ filename: "My Case.PDF", contentType: "application/pdf", sizeBytes: pdf.length });
    expect(doc.sha256).toMatch(/^[0-9a-f]{64}$/);
    for (const who of ["ines", "tomasz"]) {
      const res = await run(() =>
        documentLoader(get(`/proposals/${id}/science-case`, who, { proposalId: String(id) })),
      );
      expect(res.status).toBe(200);
      expect(res.headers!.get("Content-Type")).toBe("application/pdf");
      expect(res.headers!.get("Content-Disposition")).toMatch(/^attachment; filename="My Case\.PDF"/);
      expect(res.headers!.get("X-Content-Type-Options")).toBe("nosniff");
      expect(Buffer.from(res.body!).equals(Buffer.from(pdf))).toBe(true);
    }
    expect(
      (await run(() => documentLoader(get(`/proposals/${id}/science-case`, "amara", { proposalId: String(id) }))))
        .status,
    ).toBe(404);
    expect(
      (await run(() => documentLoader(get(`/proposals/${id}/science-case`, null, { proposalId: String(id) }))))
        .location,
    ).toMatch(/^\/sign-in/);
  });

  it("refuses a PNG renamed .pdf by its content, with a clear message, and keeps the old file", async () => {
    const id = await newDraft("ines", "PNG check");
    await upload(id, "ines", makeTinyPdf(["original"]), "original.pdf");
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(500).fill(7)]);
    const out = await upload(id, "ines", png, "figure.pdf", "application/pdf");
    expect(out.status).toBe(400);
    expect(out.data.errors.document).toMatch(/^Science case: The file is not a PDF/);
    const [doc] = await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id));
    expect(doc.filename).toBe("original.pdf");
  });

  it("refuses a file over 10 MB with 413 and stores nothing", async () => {
    const id = await newDraft("ines", "Big check");
    const big = new Uint8Array(MAX_PDF_BYTES + 1);
    big.set(Buffer.from("%PDF-1.7\n"));
    big.set(Buffer.from("%%EOF\n"), big.length - 6);
    const out = await upload(id, "ines", big, "big.pdf");
    expect(out.status).toBe(413);
    expect(out.data.errors.document).toMatch(/larger than the 10\.0 MB limit/);
    expect(await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id))).toEqual([]);
  });

  it("stops reading a body without a length as soon as it passes the cap", async () => {
    const id = await newDraft("ines", "Stream check");
    const chunk = new Uint8Array(1024 * 1024).fill(0x41);
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled >= 50 * chunk.length) return controller.close();
        pulled += chunk.length;
        controller.enqueue(chunk);
      },
    });
    const out = await run(() =>
      editorAction(
        routeArgs(`/proposals/${id}`, {
          method: "POST",
          body,
          duplex: "half",
          headers: { Cookie: cookie.ines, "Content-Type": "multipart/form-data; boundary=----x" },
          params: { proposalId: String(id) },
        } as RequestInit & { duplex: "half"; params: Record<string, string> }),
      ),
    );
    expect(out.status).toBe(413);
    // At most the cap plus the chunk in flight and one read ahead were pulled, not the 50 MB offered.
    expect(pulled).toBeLessThanOrEqual(MAX_UPLOAD_BODY_BYTES + 2 * chunk.length);
  });
});

// ---------------------------------------------------------------- submitting

describe("submitting, withdrawing and reopening", () => {
  it("lists what is missing and refuses an incomplete proposal", async () => {
    const id = await newDraft("ines", "Incomplete");
    const out = await editor(id, "ines", { intent: "submit" });
    expect(out.status).toBe(400);
    expect(out.data.errors.form).toBe(
      "The proposal is not complete yet. It still needs an abstract, a science category, an instrument and band, at least one target, requested hours for at least one configuration and the science case (PDF).",
    );
    expect((await proposalRow(id)).status).toBe("draft");
  });

  it("freezes a version with the report and the PDF, queues the notices, then refuses edits", async () => {
    const id = await completeDraft("Ready to go");
    await editor(id, "ines", { intent: "add-member", email: people.tomasz });
    // A co-investigator may submit.
    const out = await editor(id, "tomasz", { intent: "submit" });
    expect(out.status).toBe(302);
    const row = await proposalRow(id);
    expect(row).toMatchObject({ status: "submitted", currentVersion: 1 });
    const [v] = await testDb().select().from(proposalVersions).where(eq(proposalVersions.proposalId, id));
    const snap = v.snapshot as unknown as ProposalSnapshot;
    expect(snap).toMatchObject({
      title: "Ready to go",
      abstract: "We measure a diameter.",
      scienceCategory: "Stellar surfaces and diameters",
    });
    expect(snap.targets.map((t) => t.name)).toEqual(["Lumbre Nova 12"]);
    expect(snap.hours).toEqual([{ configurationId: configId["compact-3"], configuration: "compact-3", hours: 6 }]);
    expect(snap.feasibility.cells).toHaveLength(1);
    expect(snap.feasibility.cells[0].lines.map((l) => l.check)).toEqual([
      "combiner",
      "observable-time",
      "resolution",
      "visibility",
      "magnitude",
      "closure",
    ]);
    const [doc] = await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id));
    expect(v.documentSha256).toBe(doc.sha256);
    expect(Buffer.from(v.documentData!).equals(Buffer.from(doc.data))).toBe(true);
    expect(v.submittedById).toBe(userId.tomasz);
    const notices = await testDb()
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.subject, 'Proposal submitted: "Ready to go" (T-open)'));
    expect(notices.map((n) => n.toAddress).sort()).toEqual([people.ines, people.tomasz].sort());
    expect(notices.every((n) => n.kind === "submission")).toBe(true);

    // Read-only now: every change is refused and the snapshot stays as it was.
    const edit = await editor(id, "ines", {
      intent: "save",
      title: "Changed after",
      abstract: "",
      scienceCategory: "",
      bandId: "",
    });
    expect(edit.status).toBe(409);
    expect((await upload(id, "ines", makeTinyPdf(["new"]), "new.pdf")).status).toBe(409);
    expect((await editor(id, "ines", { intent: "submit" })).status).toBe(409);
    const [again] = await testDb().select().from(proposalVersions).where(eq(proposalVersions.proposalId, id));
    expect(again.snapshot).toEqual(v.snapshot);
    expect((await proposalRow(id)).title).toBe("Ready to go");

    // The frozen report and version are what the pages show.
    const feas = await run(() =>
      feasibilityLoader(get(`/proposals/${id}/feasibility`, "ines", { proposalId: String(id) })),
    );
    expect(feas.data.frozen).toBe(true);
    expect(((await feas.data.report) as FeasibilityReport).computedAt).toBe(snap.feasibility.computedAt);
    const version = await run(() =>
      versionLoader(get(`/proposals/${id}/versions/1`, "ines", { proposalId: String(id), version: "1" })),
    );
    expect(version.data.snapshot.title).toBe("Ready to go");
    expect(
      (
        await run(() =>
          versionLoader(get(`/proposals/${id}/versions/1`, "amara", { proposalId: String(id), version: "1" })),
        )
      ).status,
    ).toBe(404);
    expect(
      (
        await run(() =>
          versionLoader(get(`/proposals/${id}/versions/2`, "ines", { proposalId: String(id), version: "2" })),
        )
      ).status,
    ).toBe(404);
  });

  it("lets only the PI withdraw and reopen, and a new submission adds version 2 beside the first", async () => {
    const id = await completeDraft("Second thoughts");
    await editor(id, "ines", { intent: "add-member", email: people.tomasz });
    expect((await editor(id, "ines", { intent: "submit" })).status).toBe(302);
    const coI = await editor(id, "tomasz", { intent: "withdraw" });
    expect(coI.status).toBe(403);
    expect(coI.data.errors.form).toBe("Only the PI can withdraw the proposal.");
    expect((await editor(id, "ines", { intent: "withdraw" })).status).toBe(302);
    expect((await proposalRow(id)).status).toBe("withdrawn");
    const withdrawn = await testDb()
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.subject, 'Proposal withdrawn: "Second thoughts" (T-open)'));
    expect(withdrawn).toHaveLength(2);
    expect((await editor(id, "ines", { intent: "withdraw" })).status).toBe(409);
    expect((await editor(id, "tomasz", { intent: "reopen" })).status).toBe(403);
    expect((await editor(id, "ines", { intent: "reopen" })).status).toBe(302);
    expect((await proposalRow(id)).status).toBe("draft");
    expect(
      (
        await editor(id, "ines", {
          intent: "save",
          title: "Second thoughts, revised",
          abstract: "Revised.",
          scienceCategory: "Stellar surfaces and diameters",
          bandId: String(bandH),
        })
      ).status,
    ).toBe(302);
    expect((await editor(id, "ines", { intent: "submit" })).status).toBe(302);
    const versions = await testDb()
      .select()
      .from(proposalVersions)
      .where(eq(proposalVersions.proposalId, id))
      .orderBy(asc(proposalVersions.version));
    expect(versions.map((v) => [v.version, (v.snapshot as unknown as ProposalSnapshot).title])).toEqual([
      [1, "Second thoughts"],
      [2, "Second thoughts, revised"],
    ]);
    expect((await proposalRow(id)).currentVersion).toBe(2);
    // The first version's PDF can still be downloaded.
    const v1 = await run(() =>
      documentLoader(get(`/proposals/${id}/science-case?version=1`, "tomasz", { proposalId: String(id) })),
    );
    expect(v1.status).toBe(200);
  });

  it("refuses to reopen once the deadline has passed", async () => {
    const db = testDb();
    const [p] = await db
      .insert(proposals)
      .values({
        cycleId: closedCycleId,
        piId: userId.ines,
        title: "Withdrawn late",
        status: "withdrawn",
        currentVersion: 1,
      })
      .returning();
    const out = await editor(p.id, "ines", { intent: "reopen" });
    expect(out.status).toBe(409);
    expect(out.data.errors.form).toMatch(/T-closed deadline .* has passed: the proposal can no longer be reopened/);
    expect((await proposalRow(p.id)).status).toBe("withdrawn");
  });
});

// ---------------------------------------------------------------- the report page

describe("the feasibility page", () => {
  it("computes a draft's report for each target × requested configuration", async () => {
    const id = await completeDraft("Feasible?");
    await editor(id, "ines", {
      intent: "hours",
      [`hours-${configId["compact-3"]}`]: "6",
      [`hours-${configId["extended-6"]}`]: "4",
    });
    const out = await run(() =>
      feasibilityLoader(get(`/proposals/${id}/feasibility`, "ines", { proposalId: String(id) })),
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
    const a = await completeDraft("Owner A");
    const b = await newDraft("ines", "Owner B");
    const [t] = await testDb()
      .select()
      .from(proposalTargets)
      .where(and(eq(proposalTargets.proposalId, a)));
    expect(
      (
        await run(() =>
          targetLoader(
            get(`/proposals/${b}/targets/${t.id}`, "ines", { proposalId: String(b), targetId: String(t.id) }),
          ),
        )
      ).status,
    ).toBe(404);
    expect(
      (
        await run(() =>
          targetLoader(
            get(`/proposals/${a}/targets/${t.id}`, "ines", { proposalId: String(a), targetId: String(t.id) }),
          ),
        )
      ).status,
    ).toBe(200);
  });
});
