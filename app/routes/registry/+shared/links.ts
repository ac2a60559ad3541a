/** Addresses of the registry's pages that carry more than a route parameter, or that several pages share. */
import { href } from "react-router";

/** A registry page for one site: `?site=<id>` when a site is named. */
export const withSite = (path: string, siteId?: number | null) => (siteId ? `${path}?site=${siteId}` : path);

/** The registry page, of one site when it is named. */
export const overviewHref = (siteId?: number | null) => withSite(href("/registry"), siteId);

/** An instrument's edit page, where its bands are listed. */
export const instrumentHref = (id: number) =>
  href("/registry/instruments/:instrumentId/edit", { instrumentId: String(id) });

/** A station's page. */
export const stationHref = (id: number) => href("/registry/stations/:stationId", { stationId: String(id) });
