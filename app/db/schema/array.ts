import {
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
 * A named part of a site (a station, a configuration, an instrument): its own columns between the site
 * reference with the name and the timestamps; the name is unique at the site.
 */
function partOfSite<TName extends string, TColumns extends Record<string, PgColumnBuilderBase>>(
  name: TName,
  columns: TColumns,
) {
  return pgTable(
    name,
    { id: serialId(), siteId: refTo(() => sites.id), name: text("name").notNull(), ...columns, ...timestamps },
    (t) => [uniqueIndex(`${name}_site_name_key`).on(t.siteId, t.name)],
  );
}

export const stations = partOfSite("stations", {
  /** Local east, north, up from the array reference point, metres. */
  eastM: doublePrecision("east_m").notNull(),
  northM: doublePrecision("north_m").notNull(),
  upM: doublePrecision("up_m").notNull().default(0),
  /** Fixed optical path offset of the station's light path, metres. */
  pathOffsetM: doublePrecision("path_offset_m").notNull().default(0),
});

export const configurations = partOfSite("configurations", {
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

export const instruments = partOfSite("instruments", {
  description: text("description").notNull().default(""),
  /** Number of telescopes the combiner can take at once. */
  maxTelescopes: integer("max_telescopes").notNull(),
});

export const bands = pgTable(
  "bands",
  {
    id: serialId(),
    instrumentId: refTo(() => instruments.id),
    name: text("name").notNull(),
    /** Central wavelength, metres. */
    centralWavelengthM: doublePrecision("central_wavelength_m").notNull(),
    /** Number of spectral channels across the band. */
    channels: integer("channels").notNull(),
    /** Full bandwidth, metres. */
    bandwidthM: doublePrecision("bandwidth_m").notNull(),
    /** Faintest magnitude in this band the instrument can fringe-track on, mag. */
    limitingMagnitude: doublePrecision("limiting_magnitude").notNull(),
    ...timestamps,
  },
  (t) => [uniqueIndex("bands_instrument_name_key").on(t.instrumentId, t.name)],
);
