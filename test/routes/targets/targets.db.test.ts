import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { targets } from "~/db/schema/proposals";
import { seedDemoScenario } from "~/db/seed/factories.server";
import type { Preview } from "~/routes/targets/+shared/preview";
import { action as editAction, loader as editLoader } from "~/routes/targets/edit";
import { loader as exportLoader } from "~/routes/targets/export";
import { action as importAction } from "~/routes/targets/import";
import { action as createAction, loader as listLoader } from "~/routes/targets/index";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";
import { parseTargetCsv } from "~/services/targets/csv";

let ines = "";
let tomasz = "";
let scheduler = "";
let inesId = 0;

async function cookieFor(email: string) {
  const user = await findUserByEmail(testDb(), email);
  const { token } = await createSession(testDb(), user!.id, { method: "sso" });
  return { cookie: `fd_session=${token}`, id: user!.id };
}

beforeAll(async () => {
  await seedDemoScenario(testDb());
  const i = await cookieFor("ines.arroyo@valle-alto.example");
  ines = i.cookie;
  inesId = i.id;
  tomasz = (await cookieFor("tomasz.wierzbicki@baltic-stellar.example")).cookie;
  scheduler = (await cookieFor("mei.chao@sierra-lumbre.example")).cookie;
});

const mine = () => testDb().select().from(targets).where(eq(targets.ownerId, inesId));
const header = "name,ra,dec,model,size_mas,mag_H";
/** A list of `header` and the given rows. */
const csvOf = (...rows: string[]) => [header, ...rows].join("\n");

/** The import's answer to Inés's post that is not a redirect, as React Router represents `data(…)`. */
type ImportAnswer = { init: { status: number }; data: { preview: Preview; fileError: string | null } };
const postImport = async (fields: Record<string, string>) =>
  (await importAction(routeArgs("/targets/import", formPost(fields, { Cookie: ines })))) as ImportAnswer;

describe("My targets", () => {
  it("adds a target typed in sexagesimal with a model and magnitudes", async () => {
    const res = await settle(() =>
      createAction(
        routeArgs(
          "/targets",
          formPost(
            {
              intent: "create",
              name: "Lumbre Nova 12",
              ra: "05:36:12.8",
              dec: "-01:12:07",
              model: "uniformDisk",
              size_mas: "3.1",
              mag_H: "4.2",
              mag_K: "",
              mag_N: "",
            },
            { Cookie: ines },
          ),
        ),
      ),
    );
    expect(res.status).toBe(302);
    const [row] = await mine();
    // 05h36m12.8s × 15°/h = 84.0533° (common practice).
    expect(row.raDeg).toBeCloseTo(84.053333, 5);
    expect(row.model).toEqual({ type: "uniformDisk", diameterMas: 3.1 });
    expect(row.magnitudes).toEqual({ H: 4.2 });
  });

  it("names the bad fields, keeps the input and writes nothing", async () => {
    const out = (await createAction(
      routeArgs(
        "/targets",
        formPost(
          { intent: "create", name: "Broken", ra: "26:00:00", dec: "-95", model: "gaussian", size_mas: "-2" },
          { Cookie: ines },
        ),
      ),
    )) as { init: { status: number }; data: { values: Record<string, string>; errors: Record<string, string> } };
    expect(out.init.status).toBe(400);
    expect(out.data.values.ra).toBe("26:00:00");
    expect(Object.keys(out.data.errors).sort()).toEqual(["dec", "ra", "size_mas"]);
    expect(out.data.errors.ra).toMatch(/^Right ascension/);
    expect((await mine()).map((t) => t.name)).not.toContain("Broken");
  });

  it("refuses a second target of the same name", async () => {
    const out = (await createAction(
      routeArgs(
        "/targets",
        formPost({ intent: "create", name: "lumbre nova 12", ra: "1", dec: "1", model: "point" }, { Cookie: ines }),
      ),
    )) as { data: { errors: Record<string, string> } };
    expect(out.data.errors.name).toBe("Name: you already have a target called lumbre nova 12");
  });

  it("keeps each person's targets to themselves (404) and refuses other roles (403)", async () => {
    const [t] = await mine();
    const other = await settle(() =>
      editLoader(routeArgs(`/targets/${t.id}`, { headers: { Cookie: tomasz }, params: { targetId: String(t.id) } })),
    );
    expect(other.status).toBe(404);
    const del = await settle(() =>
      editAction(
        routeArgs(`/targets/${t.id}`, {
          ...formPost({ intent: "delete" }, { Cookie: tomasz }),
          params: { targetId: String(t.id) },
        }),
      ),
    );
    expect(del.status).toBe(404);
    expect(await mine()).toHaveLength(1);
    const role = await settle(() => listLoader(routeArgs("/targets", { headers: { Cookie: scheduler } })));
    expect(role.status).toBe(403);
  });

  it("imports nothing when any row is broken (bad RA, missing value, duplicate name)", async () => {
    const csv = csvOf(
      "Ceniza A,06:00:00,-20:00:00,point,,5",
      "Ceniza B,99:00:00,-20,point,,5",
      "Ceniza C,07:00:00,-20,uniformDisk,,5",
      "Ceniza A,08:00:00,-20,point,,5",
    );
    const out = await postImport({ intent: "import", csv });
    expect(out.init.status).toBe(400);
    expect(out.data.preview.errors.map((e) => `${e.row}:${e.column}`)).toEqual(["3:ra", "4:size_mas", "5:name"]);
    expect((await mine()).map((t) => t.name)).toEqual(["Lumbre Nova 12"]);
  });

  it("refuses a file without the required columns", async () => {
    const out = await postImport({ intent: "import", csv: "name,ra\nX,1" });
    expect(out.data.preview.errors[0].message).toBe("missing column dec (the header needs name, ra, dec)");
  });

  it("previews, then imports a good list in one go; replacing updates by name", async () => {
    const csv = csvOf(
      "Ceniza A,06:00:00,-20:00:00,point,,5",
      "Lumbre Nova 12,05:36:12.8,-01:12:07,uniformDisk,3.5,4.1",
    );
    const preview = await postImport({ intent: "preview", csv });
    expect(preview.data.preview.errors.map((e) => e.message)).toEqual([
      '"Lumbre Nova 12" is already in My targets with other values (tick "replace" to update it)',
    ]);
    expect(await mine()).toHaveLength(1);
    const withReplace = await postImport({ intent: "preview", csv, replace: "on" });
    expect(withReplace.data.preview.errors).toEqual([]);
    expect(withReplace.data.preview.rows.map((r) => `${r.name}:${r.change}`)).toEqual([
      "Ceniza A:new",
      "Lumbre Nova 12:update",
    ]);
    const done = await settle(() =>
      importAction(routeArgs("/targets/import", formPost({ intent: "import", csv, replace: "on" }, { Cookie: ines }))),
    );
    expect(done.status).toBe(302);
    const rows = await mine();
    expect(rows.map((t) => t.name).sort()).toEqual(["Ceniza A", "Lumbre Nova 12"]);
    expect(rows.find((t) => t.name === "Lumbre Nova 12")?.model).toEqual({ type: "uniformDisk", diameterMas: 3.5 });
  });

  it("refuses an oversized upload before reading it", async () => {
    const out = (await importAction(
      routeArgs("/targets/import", {
        method: "POST",
        body: "x",
        headers: {
          Cookie: ines,
          "Content-Type": "application/x-www-form-urlencoded",
          "Content-Length": String(5 * 1024 * 1024),
        },
      }),
    )) as { init: { status: number }; data: { fileError: string } };
    expect(out.init.status).toBe(400);
    expect(out.data.fileError).toMatch(/larger than 512 KB/);
  });

  it("exports the list as CSV that the import reads back", async () => {
    const res = await exportLoader(routeArgs("/targets/export.csv", { headers: { Cookie: ines } }));
    expect(res.headers.get("Content-Type")).toMatch(/text\/csv/);
    const text = await res.text();
    expect(text.split(/\r?\n/)[0]).toBe(
      "name,ra,dec,model,size_mas,ld_coefficient,separation_mas,position_angle_deg,flux_ratio,mag_H,notes",
    );
    const back = parseTargetCsv(text);
    expect(back.errors).toEqual([]);
    expect(back.targets.map((t) => t.name).sort()).toEqual(["Ceniza A", "Lumbre Nova 12"]);
  });
});
