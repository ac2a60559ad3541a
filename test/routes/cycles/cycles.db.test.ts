import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { cycles, proposalHours, proposals } from "~/db/schema/proposals";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { demoCycles } from "~/db/seed/scenario";
import { action as editAction, loader as editLoader } from "~/routes/cycles/edit";
import { loader as listLoader } from "~/routes/cycles/index";
import { action as newAction } from "~/routes/cycles/new";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";
import { configurationChoices } from "~/services/cycles/configurations.server";

let chair = "";
let proposer = "";
let configIds: Record<string, number> = {};

async function cookieFor(email: string) {
  const user = await findUserByEmail(testDb(), email);
  const { token } = await createSession(testDb(), user!.id, { method: "sso" });
  return `fd_session=${token}`;
}

beforeAll(async () => {
  await seedDemoScenario(testDb());
  chair = await cookieFor("henrik.solberg@fjellvik.example");
  proposer = await cookieFor("ines.arroyo@valle-alto.example");
  configIds = Object.fromEntries((await configurationChoices(testDb())).map((c) => [c.name, c.id]));
});

function cycleForm(over: Record<string, string | string[]> = {}) {
  return {
    name: "T2031B",
    description: "Second semester",
    observingStart: "2027-09-01",
    observingEnd: "2028-02-28",
    submissionDeadline: "2027-06-15T12:00",
    scoreBest: "1",
    scoreWorst: "5",
    offered: [String(configIds["compact-3"]), String(configIds["extended-6"])],
    [`nights-${configIds["compact-3"]}`]: "30",
    [`nights-${configIds["extended-6"]}`]: "20",
    ...over,
  };
}

describe("cycles", () => {
  it("lists the demo cycle for a signed-in person; only the chair may manage", async () => {
    const asProposer = await listLoader(routeArgs("/cycles", { headers: { Cookie: proposer } }));
    expect(asProposer.canManage).toBe(false);
    const demo = demoCycles(new Date());
    expect(asProposer.cycles.map((c: { name: string }) => c.name)).toEqual(
      expect.arrayContaining([demo.current.name, demo.review.name, demo.open.name]),
    );
    const asChair = await listLoader(routeArgs("/cycles", { headers: { Cookie: chair } }));
    expect(asChair.canManage).toBe(true);
  });

  it("lets the chair create a cycle with its offers and nights", async () => {
    const res = await settle(() => newAction(routeArgs("/cycles/new", formPost(cycleForm(), { Cookie: chair }))));
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/cycles");
    const [row] = await testDb().select().from(cycles).where(eq(cycles.name, "T2031B"));
    expect(row.submissionDeadline.toISOString()).toBe("2027-06-15T12:00:00.000Z");
    // A new cycle is being prepared until the chair opens it; the scale is the default 1 … 5.
    expect([row.state, row.scoreBest, row.scoreWorst, row.reviewDeadline]).toEqual(["draft", 1, 5, null]);
    const list = await listLoader(routeArgs("/cycles", { headers: { Cookie: chair } }));
    const b = list.cycles.find((c: { name: string }) => c.name === "T2031B");
    expect(b?.offers).toEqual([
      { name: "compact-3", nightsAvailable: 30 },
      { name: "extended-6", nightsAvailable: 20 },
    ]);
  });

  it("names each bad field and keeps what was typed", async () => {
    const out = (await newAction(
      routeArgs(
        "/cycles/new",
        formPost(
          cycleForm({
            name: "2027C",
            observingStart: "2027-02-30",
            observingEnd: "2026-01-01",
            submissionDeadline: "tomorrow",
            [`nights-${configIds["compact-3"]}`]: "-4",
          }),
          { Cookie: chair },
        ),
      ),
    )) as { init: { status: number }; data: { values: { name: string }; errors: Record<string, string> } };
    expect(out.init.status).toBe(400);
    expect(out.data.values.name).toBe("2027C");
    expect(out.data.errors.observingStart).toBe("First night: not a real date");
    expect(out.data.errors.submissionDeadline).toBe("Deadline: give a date and time (UTC)");
    expect(out.data.errors[`nights-${configIds["compact-3"]}`]).toBe("Nights: a number from 0 to 366");
    expect(await testDb().select().from(cycles).where(eq(cycles.name, "2027C"))).toHaveLength(0);
  });

  it("refuses a deadline after the first night, an empty offer and a duplicate name", async () => {
    const late = (await newAction(
      routeArgs(
        "/cycles/new",
        formPost(cycleForm({ name: "X1", submissionDeadline: "2027-09-02T00:00" }), { Cookie: chair }),
      ),
    )) as {
      data: { errors: Record<string, string> };
    };
    expect(late.data.errors.submissionDeadline).toBe("Deadline: must fall before the first night of the cycle");
    const none = (await newAction(
      routeArgs("/cycles/new", formPost(cycleForm({ name: "X2", offered: [] }), { Cookie: chair })),
    )) as {
      data: { errors: Record<string, string> };
    };
    expect(none.data.errors.offered).toBe("Configurations: offer at least one configuration");
    const dup = (await newAction(
      routeArgs("/cycles/new", formPost(cycleForm({ name: demoCycles(new Date()).open.name }), { Cookie: chair })),
    )) as {
      data: { errors: Record<string, string> };
    };
    expect(dup.data.errors.name).toBe(`Name: a cycle called ${demoCycles(new Date()).open.name} exists already`);
  });

  it("refuses proposers (403) and anonymous visitors (sign-in)", async () => {
    const forbidden = await settle(() =>
      newAction(routeArgs("/cycles/new", formPost(cycleForm({ name: "Z" }), { Cookie: proposer }))),
    );
    expect(forbidden.status).toBe(403);
    const anon = await settle(() => newAction(routeArgs("/cycles/new", formPost(cycleForm({ name: "Z" })))));
    expect(anon.status).toBe(302);
    expect(anon.headers.get("Location")).toMatch(/^\/sign-in/);
  });

  it("keeps a configuration on offer while proposals of the cycle request it", async () => {
    const [cycle] = await testDb().select().from(cycles).where(eq(cycles.name, "T2031B"));
    const pi = await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example");
    const [p] = await testDb().insert(proposals).values({ cycleId: cycle.id, piId: pi!.id, title: "Test" }).returning();
    await testDb()
      .insert(proposalHours)
      .values({ proposalId: p.id, configurationId: configIds["medium-4"], hours: 10 });
    const page = await editLoader(
      routeArgs(`/cycles/${cycle.id}/edit`, { headers: { Cookie: chair }, params: { cycleId: String(cycle.id) } }),
    );
    const form = { ...page.values, offered: [String(configIds["compact-3"])] } as Record<string, unknown>;
    const fields: Record<string, string | string[]> = {};
    for (const [k, val] of Object.entries(form)) if (k !== "nights") fields[k] = val as string | string[];
    fields[`nights-${configIds["compact-3"]}`] = "30";
    const out = (await editAction(
      routeArgs(`/cycles/${cycle.id}/edit`, {
        ...formPost(fields, { Cookie: chair }),
        params: { cycleId: String(cycle.id) },
      }),
    )) as { data: { errors: Record<string, string> } };
    expect(out.data.errors.offered).toBe("Configurations: proposals already request medium-4; keep them on offer");
  });

  it("answers 404 for an unknown cycle", async () => {
    const res = await settle(() =>
      editLoader(routeArgs("/cycles/99999/edit", { headers: { Cookie: chair }, params: { cycleId: "99999" } })),
    );
    expect(res.status).toBe(404);
    const junk = await settle(() =>
      editLoader(routeArgs("/cycles/abc/edit", { headers: { Cookie: chair }, params: { cycleId: "abc" } })),
    );
    expect(junk.status).toBe(404);
  });
});
