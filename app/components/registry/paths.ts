/** Addresses of the registry's pages, shared by loaders, actions and links. */
export const registryPaths = {
  overview: (siteId?: number | null) => (siteId ? `/registry?site=${siteId}` : "/registry"),
  newSite: () => "/registry/sites/new",
  editSite: (siteId: number) => `/registry/sites/${siteId}/edit`,
  station: (stationId: number) => `/registry/stations/${stationId}`,
  newStation: (siteId: number) => `/registry/stations/new?site=${siteId}`,
  editStation: (stationId: number) => `/registry/stations/${stationId}/edit`,
  newConfiguration: (siteId: number) => `/registry/configurations/new?site=${siteId}`,
  editConfiguration: (configurationId: number) => `/registry/configurations/${configurationId}/edit`,
  newInstrument: (siteId: number) => `/registry/instruments/new?site=${siteId}`,
  editInstrument: (instrumentId: number) => `/registry/instruments/${instrumentId}/edit`,
  newBand: (instrumentId: number) => `/registry/instruments/${instrumentId}/bands/new`,
  editBand: (bandId: number) => `/registry/bands/${bandId}/edit`,
  importPage: (siteId?: number | null) => (siteId ? `/registry/import?site=${siteId}` : "/registry/import"),
  exportFile: (file: string, siteId?: number | null) => `/registry/export/${file}${siteId ? `?site=${siteId}` : ""}`,
};
