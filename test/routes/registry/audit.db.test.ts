/**
 * Every change to the array registry (create, edit, delete, import) leaves one audit_log row in the
 * transaction of the change, naming the administrator, the action and the record; a refused change
 * leaves none. The People page lists them.
 */
import { testDb } from "@test/routes";
import { desc, eq, gt } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { bands, configurations, sites, stations } from "~/db/schema/array";
import { auditLog } from "~/db/schema/auth";
import { users } from "~/db/schema/users";
import { loader as peopleLoader } from "~/routes/admin/users";
import { action as bandEditAction } from "~/routes/registry/bands/edit";
import { action as configNewAction } from "~/routes/registry/configurations/new";
import { action as importAction } from "~/routes/registry/import";
import { action as siteEditAction } from "~/routes/registry/sites/edit";
import { action as siteNewAction } from "~/routes/registry/sites/new";
import { action as stationEditAction } from "~/routes/registry/stations/edit";
import { get, multipart, remove, rowByName, run, save, seedAndSignIn, smallSite, stationFields } from "./support";

let adminId: number;

beforeAll(async () => {
  await seedAndSignIn();
  const [admin] = await testDb().select().from(users).where(eq(users.email, "rafael.quispe@sierra-lumbre.example"));
  adminId = admin.id;
});

/** The audit rows written after row `sinceId`, oldest first. */
async function auditSince(sinceId: number) {
  const rows = await testDb().select().from(auditLog).where(gt(auditLog.id, sinceId)).orderBy(auditLog.id);
  return rows.map((r) => ({ actorId: r.actorId, action: r.action, detail: r.detail, createdAt: r.createdAt }));
}

async function lastAuditId() {
  const [row] = await testDb().select({ id: auditLog.id }).from(auditLog).orderBy(desc(auditLog.id)).limit(1);
  return row?.id ?? 0;
}

const site = {
  name: "Cerro Registro",
  latitudeDeg: "-24.6",
  longitudeDeg: "-70.4",
  altitudeM: "2635",
  minElevationDeg: "25",
  delayLineStrokeM: "120",
  timeZone: "UTC",
};

describe("the registry's audit trail", () => {
  it("records a site's creation, edit and deletion with who, what, which record and when", async () => {
    const since = await lastAuditId();
    const before = Date.now();
    const created = await save(siteNewAction, "/registry/sites/new", site);
    expect(created.status).toBe(302);
    const [row] = await testDb().select().from(sites).where(eq(sites.name, "Cerro Registro"));
    const params = { siteId: String(row.id) };
    const path = `/registry/sites/${row.id}/edit`;
    expect((await save(siteEditAction, path, { ...site, name: "Cerro Registro Norte" }, params)).status).toBe(302);
    expect((await remove(siteEditAction, path, params, { confirmName: "Cerro Registro Norte" })).status).toBe(302);

    const rows = await auditSince(since);
    expect(rows.map(({ createdAt: _, ...r }) => r)).toEqual([
      {
        actorId: adminId,
        action: "registry.created",
        detail: { entity: "site", id: row.id, name: "Cerro Registro" },
      },
      {
        actorId: adminId,
        action: "registry.updated",
        detail: { entity: "site", id: row.id, name: "Cerro Registro Norte" },
      },
      {
        actorId: adminId,
        action: "registry.deleted",
        detail: { entity: "site", id: row.id, name: "Cerro Registro Norte" },
      },
    ]);
    for (const r of rows) expect(r.createdAt.getTime()).toBeGreaterThanOrEqual(before - 5_000);
  });

  it("records stations, configurations and bands, and nothing for a change that is refused", async () => {
    const small = await smallSite("Valle Auditado");
    const a1 = (await rowByName(stations, small.id, "A1"))!;
    const since = await lastAuditId();

    // A1 is in the configuration "pair": the delete is refused, and no row says it happened.
    const refused = await remove(stationEditAction, `/registry/stations/${a1.id}/edit`, { stationId: String(a1.id) });
    expect(refused.status).toBe(409);
    // A bad value is refused before anything is written.
    const bad = await save(stationEditAction, `/registry/stations/${a1.id}/edit`, stationFields("A1", "x", "0"), {
      stationId: String(a1.id),
    });
    expect(bad.status).toBe(400);
    expect(await auditSince(since)).toEqual([]);

    const edited = await save(stationEditAction, `/registry/stations/${a1.id}/edit`, stationFields("A1", "0.5", "0"), {
      stationId: String(a1.id),
    });
    expect(edited.status).toBe(302);
    const config = await save(configNewAction, "/registry/configurations/new", {
      siteId: String(small.id),
      name: "trio",
      description: "",
      stations: "A1, A3, A4",
      offered: "on",
    });
    expect(config.status).toBe(302);
    const trio = (await rowByName(configurations, small.id, "trio"))!;
    const [band] = await testDb().select().from(bands).where(eq(bands.name, "J")).orderBy(desc(bands.id)).limit(1);
    const gone = await remove(bandEditAction, `/registry/bands/${band.id}/edit`, { bandId: String(band.id) });
    expect(gone.status).toBe(302);

    expect((await auditSince(since)).map((r) => [r.actorId, r.action, r.detail])).toEqual([
      [adminId, "registry.updated", { entity: "station", id: a1.id, name: "A1" }],
      [adminId, "registry.created", { entity: "configuration", id: trio.id, name: "trio" }],
      [adminId, "registry.deleted", { entity: "band", id: band.id, name: "J" }],
    ]);
  });

  it("records an applied import once, with its summary, and nothing for a preview or a broken file", async () => {
    const small = await smallSite("Valle Importado");
    const since = await lastAuditId();
    const importing = (fields: Record<string, string>) =>
      run(() =>
        importAction(multipart("/registry/import", "admin", { kind: "stations", siteId: String(small.id), ...fields })),
      );
    const text = "name,eastM,northM,upM,pathOffsetM\nB1,-20,5,0.2,4\n";
    expect((await importing({ intent: "preview", content: text })).status).toBe(200);
    expect((await importing({ intent: "apply", content: "name,eastM\nB2,east\n" })).status).toBe(400);
    expect(await auditSince(since)).toEqual([]);

    expect((await importing({ intent: "apply", content: text })).status).toBe(302);
    const rows = await auditSince(since);
    expect(rows.map((r) => [r.actorId, r.action])).toEqual([[adminId, "registry.imported"]]);
    expect(rows[0].detail).toMatchObject({ entity: "site", kind: "stations", id: small.id, name: "Valle Importado" });
    expect(rows[0].detail.summary).toMatch(/^Stations imported into Valle Importado: 1 new/);

    // The People page's audit log lists it, newest first, with the time in UTC.
    const page = await run(() => peopleLoader(get("/admin/users", "admin")));
    expect(page.status).toBe(200);
    const entry = page.data.audit[0];
    expect(entry).toMatchObject({ action: "registry.imported", actor: "Rafael Quispe" });
    expect(entry.at).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d UTC$/);
  });
});
