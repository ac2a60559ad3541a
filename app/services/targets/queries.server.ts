/** Reading "My targets": every query is scoped to the owner. */
import { and, asc, eq, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { bands } from "~/db/schema/array";
import { targets } from "~/db/schema/proposals";

/** The owner's targets by name (the Sketchpad's target picker calls it too). */
export async function listTargets(db: Database, ownerId: number) {
  return db.select().from(targets).where(eq(targets.ownerId, ownerId)).orderBy(asc(targets.name));
}

/** One of the owner's targets, or null (someone else's target is not revealed). */
export async function getTarget(db: Database, { ownerId, targetId }: { ownerId: number; targetId: number }) {
  const [row] = await db
    .select()
    .from(targets)
    .where(and(eq(targets.id, targetId), eq(targets.ownerId, ownerId)));
  return row ?? null;
}

/** Whether the owner has another target of this name (case-insensitive). */
export async function nameTaken(
  db: Database,
  { ownerId, name, exceptId }: { ownerId: number; name: string; exceptId?: number },
) {
  const rows = await db
    .select({ id: targets.id })
    .from(targets)
    .where(and(eq(targets.ownerId, ownerId), sql`lower(${targets.name}) = lower(${name})`));
  return rows.some((r) => r.id !== exceptId);
}

/** The owner's targets by lower-case name, for the import's check of names already in the list. */
export async function targetsByName(db: Database, { ownerId }: { ownerId: number }) {
  const rows = await db
    .select({
      name: targets.name,
      raDeg: targets.raDeg,
      decDeg: targets.decDeg,
      model: targets.model,
      magnitudes: targets.magnitudes,
      notes: targets.notes,
    })
    .from(targets)
    .where(eq(targets.ownerId, ownerId));
  return new Map(rows.map((r) => [r.name.toLowerCase(), r]));
}

/** Band names of all instruments, for the magnitude columns of forms and exports. */
export async function bandNames(db: Database) {
  const rows = await db.selectDistinct({ name: bands.name }).from(bands).orderBy(asc(bands.name));
  return rows.map((r) => r.name);
}
