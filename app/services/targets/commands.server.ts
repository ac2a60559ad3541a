/** Writing "My targets": every statement is scoped to the owner. */
import { and, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { targets } from "~/db/schema/proposals";
import type { ImportedTarget } from "./csv";
import type { TargetValues } from "./schemas";

/** The owner's target `targetId` (no row of anyone else matches). */
const ownedBy = (ownerId: number, targetId: number) => and(eq(targets.id, targetId), eq(targets.ownerId, ownerId));

/** Adds a checked target to the owner's list (the Sketchpad's tests seed through it too). */
export async function createTarget(db: Database, ownerId: number, target: TargetValues) {
  const [row] = await db
    .insert(targets)
    .values({ ownerId, ...target })
    .returning();
  return row;
}

export async function updateTarget(
  db: Database,
  { ownerId, targetId, target }: { ownerId: number; targetId: number; target: TargetValues },
) {
  const [row] = await db.update(targets).set(target).where(ownedBy(ownerId, targetId)).returning();
  return row ?? null;
}

/** Removes the target; false when the owner has no such target. */
export async function deleteTarget(db: Database, { ownerId, targetId }: { ownerId: number; targetId: number }) {
  const rows = await db.delete(targets).where(ownedBy(ownerId, targetId)).returning({ id: targets.id });
  return rows.length > 0;
}

/**
 * Writes a checked import in one transaction: new names are inserted, existing names (when
 * replacing) updated. Returns the counts.
 */
export async function importTargets(db: Database, { ownerId, list }: { ownerId: number; list: ImportedTarget[] }) {
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
        await tx.update(targets).set(t).where(ownedBy(ownerId, id));
        updated += 1;
      } else {
        await tx.insert(targets).values({ ownerId, ...t });
        created += 1;
      }
    }
    return { created, updated };
  });
}
