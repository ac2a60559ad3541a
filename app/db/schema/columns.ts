import { type AnyPgColumn, integer, timestamp } from "drizzle-orm/pg-core";

/** Created/updated instants shared by every table that people edit. */
export const timestamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true })
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
