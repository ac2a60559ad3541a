/**
 * The audit trail of the array registry: every create, edit, delete and import writes one audit_log
 * row (who, what, which record) in the transaction of the change itself, so a change is never
 * recorded without happening, nor the other way round. The row's time is the database's, in UTC.
 */

import type { DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import type { RegistryEntity } from "./queries.server";

/** What happened to a registry record. */
export type RegistryChange = "created" | "updated" | "deleted";

/** One record of the registry changed by `actorId`: its kind, id and name go in the row's detail. */
export async function auditRegistryChange(
  tx: DbOrTx,
  {
    actorId,
    change,
    entity,
    id,
    name,
  }: { actorId: number; change: RegistryChange; entity: RegistryEntity; id: number; name: string },
) {
  await tx.insert(auditLog).values({ actorId, action: `registry.${change}`, detail: { entity, id, name } });
}

/** An import applied by `actorId`: what the file held, the site, and the flash's summary of the changes. */
export async function auditRegistryImport(
  tx: DbOrTx,
  {
    actorId,
    kind,
    siteId,
    siteName,
    summary,
  }: { actorId: number; kind: "stations" | "registry"; siteId: number; siteName: string; summary: string },
) {
  await tx.insert(auditLog).values({
    actorId,
    action: "registry.imported",
    detail: { entity: "site", kind, id: siteId, name: siteName, summary },
  });
}
