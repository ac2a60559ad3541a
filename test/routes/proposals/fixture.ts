/**
 * The proposal pages' tests share one world: the demo registry, an open and a closed cycle, four
 * signed-in people, and helpers that post to the pages' actions as a browser would.
 */
import { formPost, routeArgs, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, expect } from "vitest";
import { bands, configurations } from "~/db/schema/array";
import { proposals } from "~/db/schema/proposals";
import { ensureUser, seedDemoScenario } from "~/db/seed/factories.server";
import { action as editorAction } from "~/routes/proposals/editor/route";
import { action as newAction } from "~/routes/proposals/new";
import { action as targetAction } from "~/routes/proposals/target";
import { createSession } from "~/services/auth/sessions.server";
import { createCycle } from "~/services/cycles/cycles.server";
import { makeTinyPdf } from "~/services/proposals/pdf";

export type Outcome = {
  status: number;
  location: string | null;
  data: any;
  headers: Headers | null;
  body: Uint8Array | null;
};

/** Runs a loader or action and says what it answered: status, redirect, data; returned or thrown. */
export async function run(fn: () => unknown): Promise<Outcome> {
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

export const people = {
  ines: "ines.arroyo@valle-alto.example",
  tomasz: "tomasz.wierzbicki@baltic-stellar.example",
  amara: "amara.okafor@harmattan-obs.example",
  mei: "mei.chao@sierra-lumbre.example",
};
export const cookie: Record<string, string> = {};
export const userId: Record<string, number> = {};
/** Ids of the world, known once `useProposalWorld` has run. */
export const world = { openCycleId: 0, closedCycleId: 0, bandH: 0, configId: {} as Record<string, number> };

export async function signIn(key: string, email: string, roles?: ("proposer" | "scheduler")[]) {
  const user = await ensureUser(testDb(), { email, name: key, roles });
  const { token } = await createSession(testDb(), user.id, { method: "sso" });
  cookie[key] = `fd_session=${token}`;
  userId[key] = user.id;
}

/** Seeds the world before the file's tests: the demo scenario, cycle T-open (30 days left) and T-closed. */
export function useProposalWorld() {
  beforeAll(async () => {
    const db = testDb();
    await seedDemoScenario(db);
    for (const c of await db.select().from(configurations)) world.configId[c.name] = c.id;
    const [h] = await db.select().from(bands).where(eq(bands.name, "H"));
    world.bandH = h.id;
    const day = 86_400_000;
    const { configId } = world;
    // Deadlines relative to the clock, so the tests do not age.
    const cycle = (
      name: string,
      observingStart: string,
      observingEnd: string,
      deadlineDays: number,
      offers: string[],
    ) =>
      createCycle(
        db,
        {
          name,
          description: "",
          observingStart,
          observingEnd,
          submissionDeadline: new Date(Date.now() + deadlineDays * day),
          offers: offers.map((o) => ({ configurationId: configId[o], nightsAvailable: 10 })),
        },
        null,
      );
    world.openCycleId = (await cycle("T-open", "2027-03-01", "2027-08-31", 30, ["compact-3", "extended-6"])).id;
    world.closedCycleId = (await cycle("T-closed", "2026-09-01", "2027-02-28", -1, ["compact-3"])).id;
    for (const [key, email] of Object.entries(people)) await signIn(key, email);
  });
}

export const post = (
  path: string,
  key: string,
  fields: Record<string, string | string[]>,
  params: Record<string, string>,
) => routeArgs(path, { ...formPost(fields, { Cookie: cookie[key] }), params });
export const get = (path: string, key: string | null, params: Record<string, string> = {}) =>
  routeArgs(path, { headers: key ? { Cookie: cookie[key] } : {}, params });

export async function newDraft(key = "ines", title = "Test proposal", cycleId = world.openCycleId) {
  const out = await run(() => newAction(post("/proposals/new", key, { cycleId: String(cycleId), title }, {})));
  expect(out.status).toBe(302);
  return Number(/\/proposals\/(\d+)$/.exec(out.location!)![1]);
}

export const editor = (id: number, key: string, fields: Record<string, string | string[]>) =>
  run(() => editorAction(post(`/proposals/${id}`, key, fields, { proposalId: String(id) })));

/** The "save" intent of the proposal text, the fields not given left empty. */
export const saveText = (
  id: number,
  key: string,
  fields: {
    intent?: "save" | "autosave";
    title?: string;
    abstract?: string;
    scienceCategory?: string;
    bandId?: string;
  },
) => editor(id, key, { intent: "save", title: "", abstract: "", scienceCategory: "", bandId: "", ...fields });

/** A post to the editor with a body of its own (not a form, a broken upload, a stream). */
export const rawPost = (id: number, key: string, init: RequestInit & { duplex?: "half" }) =>
  run(() =>
    editorAction(
      routeArgs(`/proposals/${id}`, {
        method: "POST",
        ...init,
        headers: { Cookie: cookie[key], ...(init.headers as Record<string, string>) },
        params: { proposalId: String(id) },
      }),
    ),
  );

export async function upload(id: number, key: string, bytes: Uint8Array, filename: string, type = "application/pdf") {
  const form = new FormData();
  form.set("intent", "upload-document");
  form.set("document", new File([new Uint8Array(bytes)], filename, { type }));
  return rawPost(id, key, { body: form });
}

/** Posts the target form of `targets/new` of proposal `id`. */
export const addTarget = (id: number, key: string, fields: Record<string, string | string[]>) =>
  run(() =>
    targetAction(post(`/proposals/${id}/targets/new`, key, fields, { proposalId: String(id), targetId: "new" })),
  );

export const proposalRow = async (id: number) =>
  (await testDb().select().from(proposals).where(eq(proposals.id, id)))[0];

/** A proposal with everything submission needs, written through the actions. */
export async function completeDraft(title = "Complete proposal") {
  const id = await newDraft("ines", title);
  const c = world.configId["compact-3"];
  expect(
    (
      await saveText(id, "ines", {
        title,
        abstract: "We measure a diameter.",
        scienceCategory: "Stellar surfaces and diameters",
        bandId: String(world.bandH),
      })
    ).status,
  ).toBe(302);
  expect((await editor(id, "ines", { intent: "hours", [`hours-${c}`]: "6", [`label-${c}`]: "compact-3" })).status).toBe(
    302,
  );
  const t = await addTarget(id, "ines", {
    name: "Lumbre Nova 12",
    ra: "09:52:50",
    dec: "-41:22:12",
    model: "uniformDisk",
    size_mas: "3",
    mag_H: "3.1",
  });
  expect(t.status).toBe(302);
  expect((await upload(id, "ines", makeTinyPdf(["Science case"]), "case.pdf")).status).toBe(302);
  return id;
}
