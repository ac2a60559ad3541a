import { relations } from "drizzle-orm";
import { bands, configurationStations, configurations, instruments, sites, stations } from "./schema/array";
import { userRoles, users } from "./schema/users";

export const sitesRelations = relations(sites, ({ many }) => ({
  stations: many(stations),
  configurations: many(configurations),
  instruments: many(instruments),
}));

export const stationsRelations = relations(stations, ({ one, many }) => ({
  site: one(sites, { fields: [stations.siteId], references: [sites.id] }),
  configurations: many(configurationStations),
}));

export const configurationsRelations = relations(configurations, ({ one, many }) => ({
  site: one(sites, { fields: [configurations.siteId], references: [sites.id] }),
  stations: many(configurationStations),
}));

export const configurationStationsRelations = relations(configurationStations, ({ one }) => ({
  configuration: one(configurations, {
    fields: [configurationStations.configurationId],
    references: [configurations.id],
  }),
  station: one(stations, { fields: [configurationStations.stationId], references: [stations.id] }),
}));

export const instrumentsRelations = relations(instruments, ({ one, many }) => ({
  site: one(sites, { fields: [instruments.siteId], references: [sites.id] }),
  bands: many(bands),
}));

export const bandsRelations = relations(bands, ({ one }) => ({
  instrument: one(instruments, { fields: [bands.instrumentId], references: [instruments.id] }),
}));

export const usersRelations = relations(users, ({ many }) => ({
  roles: many(userRoles),
}));

export const userRolesRelations = relations(userRoles, ({ one }) => ({
  user: one(users, { fields: [userRoles.userId], references: [users.id] }),
}));
