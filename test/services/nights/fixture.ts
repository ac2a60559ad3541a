/**
 * A cycle made for the Night builder's tests: its observing period around a chosen night, all three
 * demo configurations on offer, and two accepted programs on medium-4 whose targets pass near the
 * zenith that night (placed by the sidereal time at local midnight, so the fixture works for any date),
 * each with calibrators a few degrees away. Needs the demo scenario (site, stations, configurations).
 */
import { sql } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import type { Database } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import {
  cycleConfigurations,
  cycles,
  proposalHours,
  proposalMembers,
  proposals,
  proposalTargets,
} from "~/db/schema/proposals";
import { ensureUser } from "~/db/seed/factories.server";
import { jdeFromJd, julianDayFromDate, lmstHours, moonPosition, RAD_TO_DEG } from "~/engine";
import { createSession } from "~/services/auth/sessions.server";

const SITE = { latitudeDeg: -31.4, longitudeDeg: -68.9 };

export const addDays = (date: string, days: number) => {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
};

/** Local mean sidereal time at local mean midnight of the night of `date` at the demo site, degrees. */
export function midnightLstDeg(date: string): number {
  const jd = julianDayFromDate(new Date(`${date}T00:00:00Z`)) + 1 - SITE.longitudeDeg / 360;
  return lmstHours(jd, (SITE.longitudeDeg * Math.PI) / 180) * 15;
}

const wrap = (deg: number) => ((deg % 360) + 360) % 360;

/** Targets that night: three of the first program at LST −2.5 h, 0, +2 h, one of the second at LST −1 h; declinations kept off the Moon. */
export function fixtureTargets(date: string) {
  const lst = midnightLstDeg(date);
  const jd = julianDayFromDate(new Date(`${date}T00:00:00Z`)) + 1 - SITE.longitudeDeg / 360;
  const moon = moonPosition(jdeFromJd(jd));
  const moonRa = moon.raRad * RAD_TO_DEG;
  const moonDec = moon.decRad * RAD_TO_DEG;
  const place = (name: string, offsetH: number) => {
    const ra = wrap(lst + offsetH * 15);
    // Away from the Moon: if its place is within 25° in RA, move the target's declination south.
    const near = Math.abs(((ra - moonRa + 540) % 360) - 180) < 25 && Math.abs(moonDec + 31) < 25;
    const dec = near ? -58 : -31;
    return {
      name,
      raDeg: Number(ra.toFixed(3)),
      decDeg: dec,
      calibrators: [
        { name: `${name} cal A`, raDeg: Number(wrap(ra + 2.1).toFixed(3)), decDeg: dec - 1.5 },
        { name: `${name} cal B`, raDeg: Number(wrap(ra - 2.4).toFixed(3)), decDeg: dec + 1.2 },
      ],
    };
  };
  return {
    first: [place("Ardilla 1", -2.5), place("Ardilla 2", 0), place("Ardilla 3", 2)],
    second: [place("Zorzal 7", -1)],
  };
}

export type NightsFixture = Awaited<ReturnType<typeof createNightsFixture>>;

/** Creates the cycle, people and programs; returns their ids and session cookies for the people. */
export async function createNightsFixture(
  db: Database,
  { night, name = "Nights test" }: { night: string; name?: string },
) {
  const configs = await db.select().from(configurations);
  const id = (n: string) => {
    const c = configs.find((x) => x.name === n);
    if (!c) throw new Error(`fixture: no configuration ${n}`);
    return c.id;
  };
  const [cycle] = await db
    .insert(cycles)
    .values({
      name,
      observingStart: addDays(night, -10),
      observingEnd: addDays(night, 10),
      submissionDeadline: new Date(`${addDays(night, -60)}T12:00:00Z`),
    })
    .returning();
  await db.insert(cycleConfigurations).values(
    ["compact-3", "medium-4", "extended-6"].map((n) => ({
      cycleId: cycle.id,
      configurationId: id(n),
      nightsAvailable: 7,
    })),
  );
  const tag = name.toLowerCase().replace(/[^a-z0-9]+/g, "-");
  const person = (prefix: string, fullName: string, role: "proposer" | "scheduler" = "proposer") =>
    ensureUser(db, { email: `${prefix}-${tag}@nights.example`, name: `${fullName} (${name})`, roles: [role] });
  const pi = await person("pi", "Noor Quillay");
  const coi = await person("coi", "Ilan Varga");
  const other = await person("other", "Rosa Tarn");
  const scheduler = await person("sched", "Sami Oyelaran", "scheduler");
  const targets = fixtureTargets(night);
  const program = async (piId: number, title: string, hours: number, list: typeof targets.first, submitted: string) => {
    const [p] = await db
      .insert(proposals)
      .values({
        cycleId: cycle.id,
        piId,
        title,
        status: "accepted",
        submittedAt: new Date(submitted),
        currentVersion: 1,
      })
      .returning();
    await db.insert(proposalHours).values({ proposalId: p.id, configurationId: id("medium-4"), hours });
    const rows = await db
      .insert(proposalTargets)
      .values(list.map((t, position) => ({ proposalId: p.id, position, ...t, model: { type: "point" } })))
      .returning();
    return { id: p.id, targetIds: rows.map((r) => r.id) };
  };
  const first = await program(
    pi.id,
    "Winds of the Ardilla stars",
    3,
    targets.first,
    `${addDays(night, -70)}T10:00:00Z`,
  );
  await db.insert(proposalMembers).values({ proposalId: first.id, email: coi.email, userId: coi.id });
  const second = await program(other.id, "The Zorzal 7 pair", 2, targets.second, `${addDays(night, -65)}T10:00:00Z`);
  const cookie = async (userId: number) => `fd_session=${(await createSession(db, userId, { method: "sso" })).token}`;
  return {
    cycle,
    configurationIds: { compact: id("compact-3"), medium: id("medium-4"), extended: id("extended-6") },
    people: { pi, coi, other, scheduler },
    programs: { first, second },
    targets,
    cookies: {
      scheduler: await cookie(scheduler.id),
      pi: await cookie(pi.id),
      coi: await cookie(coi.id),
      other: await cookie(other.id),
    },
  };
}

/** The number of rows of a table, for "nothing was written" checks. */
export async function countRows(db: Database, table: PgTable) {
  const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(table);
  return row.n;
}
