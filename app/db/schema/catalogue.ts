import { sql } from "drizzle-orm";
import { doublePrecision, index, integer, pgTable, smallint, text } from "drizzle-orm/pg-core";
import { instant } from "./columns";

/**
 * The bundled star catalogue as reference rows (decision 009): one row per star of the package's data
 * (Hipparcos-based, to V = 8), loaded at migrate time from the installed package by
 * app/services/catalogue/table.server.ts. The server's working copy is in memory; these rows are
 * what other rows and SQL reports point at, by Hipparcos number.
 */
export const catalogueStars = pgTable(
  "catalogue_stars",
  {
    /** Hipparcos number. */
    hip: integer("hip").primaryKey(),
    /** Henry Draper number, when the data give one. */
    hd: integer("hd"),
    /** Display name: proper name, else Bayer, Flamsteed, variable, HD, else "HIP n". */
    name: text("name").notNull(),
    /** Every designation in display form ("Betelgeuse", "α Ori", "58 Ori", "HD 39801", "HIP 27989"). */
    designations: text("designations").array().notNull().default(sql`'{}'::text[]`),
    /** J2000 position (equinox and epoch J2000; the data carry no proper motions), degrees. */
    raDeg: doublePrecision("ra_deg").notNull(),
    decDeg: doublePrecision("dec_deg").notNull(),
    vMag: doublePrecision("v_mag").notNull(),
    /** B−V, magnitudes; null when the data give none. */
    bv: doublePrecision("bv"),
    /** 0 none, 1 a variable-star designation, 2 a suspected variable (NSV). */
    variability: smallint("variability").notNull().default(0),
  },
  (t) => [index("catalogue_stars_hd_idx").on(t.hd)],
);

/** Which edition of the data the rows hold: the package and its version, and the counts read. */
export const catalogueEditions = pgTable("catalogue_editions", {
  /** The npm package the data come from ("d3-celestial"). */
  source: text("source").primaryKey(),
  version: text("version").notNull(),
  stars: integer("stars").notNull(),
  nameRecords: integer("name_records").notNull(),
  namedStars: integer("named_stars").notNull(),
  loadedAt: instant("loaded_at").notNull().defaultNow(),
});
