import { type AnyPgColumn, integer, serial, timestamp } from "drizzle-orm/pg-core";

/** The row's number: `serial PRIMARY KEY` named `id`. */
export function serialId() {
  return serial("id").primaryKey();
}

/** An instant: `timestamp with time zone` (stored in UTC, shown with the zone). */
export function instant(name: string) {
  return timestamp(name, { withTimezone: true });
}

/** Created/updated instants shared by every table that people edit. */
export const timestamps = {
  createdAt: instant("created_at").notNull().defaultNow(),
  updatedAt: instant("updated_at")
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
};

type OnDelete = "cascade" | "restrict" | "set null";

/**
 * A required reference to another table's row: `integer NOT NULL REFERENCES … ON DELETE …` (cascade
 * unless told). The column name follows the key in snake_case (the client's `casing` setting).
 */
export function refTo(column: () => AnyPgColumn, onDelete: OnDelete = "cascade") {
  return integer().notNull().references(column, { onDelete });
}

/** An optional reference (NULL allowed), cleared when the row it names is deleted unless told otherwise. */
export function optionalRefTo(column: () => AnyPgColumn, onDelete: OnDelete = "set null") {
  return integer().references(column, { onDelete });
}

/** A primary key that is also a reference: at most one row per row of the other table, deleted with it. */
export function keyRefTo(column: () => AnyPgColumn) {
  return integer().primaryKey().references(column, { onDelete: "cascade" });
}
