import {
  type AnyPgColumn,
  boolean,
  doublePrecision,
  integer,
  type PgColumnBuilderBase,
  pgTable,
  primaryKey,
  text,
  uniqueIndex,
} from "drizzle-orm/pg-core";
import { refTo, serialId, timestamps } from "./columns";

/**
 * The array registry: one or more sites, each with its stations, the named station sets
 * (configurations) that cycles offer, and the instruments with their bands.
 */
export const sites = pgTable(
  "sites",
  {
    id: serialId(),
    name: text("name").notNull(),
    /** Geodetic latitude, degrees, north positive. */
    latitudeDeg: doublePrecision("latitude_deg").notNull(),
    /** Longitude, degrees, east positive. */
    longitudeDeg: doublePrecision("longitude_deg").notNull(),
    altitudeM: doublePrecision("altitude_m").notNull(),
    /** Lowest elevation the telescopes may observe at, degrees. */
    minElevationDeg: doublePrecision("min_elevation_deg").notNull(),
    /** Total delay-line stroke, metres of optical path. */
    delayLineStrokeM: doublePrecision("delay_line_stroke_m").notNull(),
    /** IANA time zone used to show local times on the site's pages. */
    timeZone: text("time_zone").notNull().default("UTC"),
    ...timestamps,
  },
  (t) => [uniqueIndex("sites_name_key").on(t.name)],
);

/**
 * A named part of a site or of an instrument (a station, a configuration, an instrument, a band): the
 * reference to its whole (`siteId`, `instrumentId`) and its name, its own columns, the timestamps; the
 * name is unique within the whole, and the part goes when its whole is deleted.
 */
function namedPart<
  TName extends string,
  TWhole extends "site" | "instrument",
  TColumns extends Record<string, PgColumnBuilderBase>,
>(name: TName, whole: TWhole, wholeId: () => AnyPgColumn, columns: TColumns) {
  const wholeKey: `${TWhole}Id` = `${whole}Id`;
  const reference = { [wholeKey]: refTo(wholeId) } as Record<`${TWhole}Id`, ReturnType<typeof refTo>>;
  return pgTable(
    name,
    { id: serialId(), ...reference, name: text("name").notNull(), ...columns, ...timestamps },
    (t) => [uniqueIndex(`${name}_${whole}_name_key`).on(t[wholeKey], t.name)],
  );
}

export const stations = namedPart("stations", "site", () => sites.id, {
  /** Local east, north, up from the array reference point, metres. */
  eastM: doublePrecision("east_m").notNull(),
  northM: doublePrecision("north_m").notNull(),
  upM: doublePrecision("up_m").notNull().default(0),
  /** Fixed optical path offset of the station's light path, metres. */
  pathOffsetM: doublePrecision("path_offset_m").notNull().default(0),
});

export const configurations = namedPart("configurations", "site", () => sites.id, {
  description: text("description").notNull().default(""),
  /** Whether proposers may currently request this configuration. */
  offered: boolean("offered").notNull().default(true),
});

export const configurationStations = pgTable(
  "configuration_stations",
  {
    configurationId: refTo(() => configurations.id),
    stationId: refTo(() => stations.id, "restrict"),
    /** Order of the station in the configuration (baseline i–j is station j minus station i). */
    position: integer("position").notNull(),
  },
  (t) => [primaryKey({ columns: [t.configurationId, t.stationId] })],
);

export const instruments = namedPart("instruments", "site", () => sites.id, {
  description: text("description").notNull().default(""),
  /** Number of telescopes the combiner can take at once. */
  maxTelescopes: integer("max_telescopes").notNull(),
});

export const bands = namedPart("bands", "instrument", () => instruments.id, {
  /** Central wavelength, metres. */
  centralWavelengthM: doublePrecision("central_wavelength_m").notNull(),
  /** Number of spectral channels across the band. */
  channels: integer("channels").notNull(),
  /** Full bandwidth, metres. */
  bandwidthM: doublePrecision("bandwidth_m").notNull(),
  /** Faintest magnitude in this band the instrument can fringe-track on, mag. */
  limitingMagnitude: doublePrecision("limiting_magnitude").notNull(),
});
