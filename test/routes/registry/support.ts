/**
 * What the registry's route tests share: the demo scenario with an administrator's and a proposer's
 * session, calling a loader or action as a given visitor, and reading back what it did.
 */
import { cookiesFrom, formPost, routeArgs, testDb } from "@test/routes";
import { and, count, eq } from "drizzle-orm";
import type { bands, configurations, instruments } from "~/db/schema/array";
import { sites, stations } from "~/db/schema/array";
import {
  ensureConfiguration,
  ensureInstrument,
  ensureSite,
  ensureStations,
  seedDemoScenario,
} from "~/db/seed/factories.server";
import { readFlash } from "~/lib/flash.server";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";

export type Who = "admin" | "proposer" | "anonymous";
export type Outcome = { status: number; location: string | null; data: any; response: Response | null };

const cookie: Record<Who, Record<string, string>> = { admin: {}, proposer: {}, anonymous: {} };

/** Seeds the demo scenario, signs in its administrator and a proposer; the demo site's id. */
export async function seedAndSignIn(): Promise<number> {
  await seedDemoScenario(testDb());
  for (const [who, email] of [
    ["admin", "rafael.quispe@sierra-lumbre.example"],
    ["proposer", "ines.arroyo@valle-alto.example"],
  ] as const) {
    const user = (await findUserByEmail(testDb(), email))!;
    const { token } = await createSession(testDb(), user.id, { method: "sso" });
    cookie[who] = { Cookie: `fd_session=${token}` };
  }
  return (await testDb().select().from(sites).where(eq(sites.name, "Sierra Lumbre Array")))[0].id;
}

/** Runs a loader or action and reports what came back, returned or thrown. */
export async function run(fn: () => unknown): Promise<Outcome> {
  const judge = (out: unknown): Outcome => {
    if (out instanceof Response)
      return { status: out.status, location: out.headers.get("Location"), data: null, response: out };
    if (out && typeof out === "object" && "init" in out && "data" in out) {
      const d = out as { data: unknown; init: { status?: number } | null };
      return { status: d.init?.status ?? 200, location: null, data: d.data, response: null };
    }
    return { status: 200, location: null, data: out, response: null };
  };
  try {
    return judge(await fn());
  } catch (e) {
    return judge(e);
  }
}

export const post = (
  path: string,
  who: Who,
  fields: Record<string, string | string[]>,
  params: Record<string, string> = {},
) => routeArgs(path, { ...formPost(fields, cookie[who]), params });
export const get = (path: string, who: Who, params: Record<string, string> = {}) =>
  routeArgs(path, { headers: cookie[who], params });

export function multipart(path: string, who: Who, fields: Record<string, string | File>) {
  const body = new FormData();
  for (const [k, val] of Object.entries(fields)) body.append(k, val);
  return routeArgs(path, { method: "POST", body, headers: cookie[who] });
}

export async function flashOf(outcome: Outcome) {
  const request = new Request("http://localhost:3000/", { headers: { Cookie: cookiesFrom(outcome.response!) } });
  return (await readFlash(request)).flash;
}

/** The row of a site's station, configuration or instrument of that name, or null. */
export async function rowByName<T extends typeof stations | typeof configurations | typeof instruments>(
  table: T,
  siteId: number,
  name: string,
): Promise<T["$inferSelect"] | null> {
  const named = table as typeof stations;
  const [row] = await testDb()
    .select()
    .from(named)
    .where(and(eq(named.siteId, siteId), eq(named.name, name)));
  return (row as T["$inferSelect"] | undefined) ?? null;
}

export const stationByName = (siteId: number, name: string) => rowByName(stations, siteId, name);

export async function countOf(
  table: typeof stations | typeof sites | typeof configurations | typeof instruments | typeof bands,
) {
  const [row] = await testDb().select({ n: count() }).from(table);
  return row.n;
}

/** A small site of its own, so tests that change things do not disturb each other. */
export async function smallSite(name: string) {
  const site = await ensureSite(testDb(), {
    name,
    latitudeDeg: 10,
    longitudeDeg: 20,
    altitudeM: 100,
    minElevationDeg: 20,
    delayLineStrokeM: 50,
    timeZone: "UTC",
  });
  await ensureStations(testDb(), site.id, [
    { name: "A1", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
    { name: "A2", eastM: 10, northM: 0, upM: 0, pathOffsetM: 1 },
    { name: "A3", eastM: 0, northM: 10, upM: 0.5, pathOffsetM: 2 },
    { name: "A4", eastM: 30, northM: 30, upM: 0, pathOffsetM: 3 },
  ]);
  await ensureConfiguration(testDb(), site.id, { name: "pair", stations: ["A1", "A2"] });
  await ensureInstrument(testDb(), site.id, {
    name: "Duo",
    maxTelescopes: 2,
    bands: [{ name: "J", centralWavelengthM: 1.25e-6, channels: 3, bandwidthM: 0.2e-6, limitingMagnitude: 6 }],
  });
  return site;
}

type Handler = (args: never) => unknown;
type Fields = Record<string, string>;

/** The administrator saves a form (intent "save") through an action. */
export const save = (handler: Handler, path: string, fields: Fields, params: Fields = {}) =>
  run(() => handler(post(path, "admin", { intent: "save", ...fields }, params)));

/** The administrator posts a page's delete form (intent "delete"). */
export const remove = (handler: Handler, path: string, params: Fields, fields: Fields = {}) =>
  run(() => handler(post(path, "admin", { intent: "delete", confirm: "yes", ...fields }, params)));

/** A station's form fields, as typed (metres). */
export const stationFields = (name: string, eastM: string, northM: string, upM = "0", pathOffsetM = "0") => ({
  name,
  eastM,
  northM,
  upM,
  pathOffsetM,
});

/** A band's form fields, as typed (micrometres). */
export const bandFields = (
  name: string,
  centralWavelengthUm: string,
  bandwidthUm: string,
  channels: string,
  limitingMagnitude: string,
) => ({ name, centralWavelengthUm, bandwidthUm, channels, limitingMagnitude });
