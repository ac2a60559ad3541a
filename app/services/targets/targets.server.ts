/** "My targets": every query is scoped to the owner. */
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { bands } from "~/db/schema/array";
import { targets } from "~/db/schema/proposals";
import type { ImportedTarget } from "~/services/targets/csv";

type TargetValues = Omit<ImportedTarget, "row">;

export async function listTargets(db: Database, ownerId: number) {
  return db.select().from(targets).where(eq(targets.ownerId, ownerId)).orderBy(asc(targets.name));
}

export async function getTarget(db: Database, ownerId: number, id: number) {
  const [row] = await db
    .select()
    .from(targets)
    .where(and(eq(targets.id, id), eq(targets.ownerId, ownerId)));
  return row ?? null;
}

export async function nameTaken(db: Database, ownerId: number, name: string, exceptId?: number) {
  const rows = await db
    .select({ id: targets.id })
    .from(targets)
    .where(and(eq(targets.ownerId, ownerId), sql`lower(${targets.name}) = lower(${name})`));
  return rows.some((r) => r.id !== exceptId);
}

export async function createTarget(db: Database, ownerId: number, t: TargetValues) {
  const [row] = await db
    .insert(targets)
    .values({ ownerId, ...t })
    .returning();
  return row;
}

export async function updateTarget(db: Database, ownerId: number, id: number, t: TargetValues) {
  const [row] = await db
    .update(targets)
    .set(t)
    .where(and(eq(targets.id, id), eq(targets.ownerId, ownerId)))
    .returning();
  return row ?? null;
}

export async function deleteTarget(db: Database, ownerId: number, id: number) {
  const rows = await db
    .delete(targets)
    .where(and(eq(targets.id, id), eq(targets.ownerId, ownerId)))
    .returning({ id: targets.id });
  return rows.length > 0;
}

/** Lower-case names of the owner's targets, for the import's duplicate check. */
export async function targetNames(db: Database, ownerId: number) {
  const rows = await db.select({ name: targets.name }).from(targets).where(eq(targets.ownerId, ownerId));
  return new Set(rows.map((r) => r.name.toLowerCase()));
}

/**
 * Writes a checked import in one transaction: new names are inserted, existing names (when
 * replacing) updated. Returns the counts.
 */
export async function importTargets(db: Database, ownerId: number, list: ImportedTarget[]) {
  return db.transaction(async (tx) => {
    const names = list.map((t) => t.name.toLowerCase());
    const existing = names.length
      ? await tx
          .select({ id: targets.id, name: targets.name })
          .from(targets)
          .where(and(eq(targets.ownerId, ownerId), inArray(sql`lower(${targets.name})`, names)))
      : [];
    const byName = new Map(existing.map((e) => [e.name.toLowerCase(), e.id]));
    let created = 0;
    let updated = 0;
    for (const { row: _row, ...t } of list) {
      const id = byName.get(t.name.toLowerCase());
      if (id) {
        await tx
          .update(targets)
          .set(t)
          .where(and(eq(targets.id, id), eq(targets.ownerId, ownerId)));
        updated += 1;
      } else {
        await tx.insert(targets).values({ ownerId, ...t });
        created += 1;
      }
    }
    return { created, updated };
  });
}

/** Band names of all instruments, for the magnitude columns of forms and exports. */
export async function bandNames(db: Database) {
  const rows = await db.selectDistinct({ name: bands.name }).from(bands).orderBy(asc(bands.name));
  return rows.map((r) => r.name);
}
