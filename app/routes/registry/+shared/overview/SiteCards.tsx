/** The registry page's cards about the site: the site chooser, its figures, the station map and table. */
import { href, Link } from "react-router";
import { ButtonLink, Card, type Column, DataTable, EmptyState } from "~/components/ui";
import type { SiteRegistry } from "~/services/registry/queries.server";
import { fixedColumn, stationColumn } from "../columns";
import { overviewHref, withSite } from "../links";
import { FactList, linkClass } from "../RegistryBits";
import { StationMap } from "../StationMap";

type StationRow = SiteRegistry["stations"][number];

const fmt = (x: number, digits: number) => x.toFixed(digits);

const stationColumns: Column<StationRow>[] = [
  stationColumn("name", "Station"),
  fixedColumn("east", "East", "m", (s) => s.eastM, 2),
  fixedColumn("north", "North", "m", (s) => s.northM, 2),
  fixedColumn("up", "Up", "m", (s) => s.upM, 2),
  fixedColumn("offset", "Path offset", "m", (s) => s.pathOffsetM, 2),
  {
    key: "radius",
    header: "Distance from centre",
    unit: "m",
    align: "right",
    value: (s) => Math.round(Math.hypot(s.eastM, s.northM) * 10) / 10,
  },
];

const editStationColumn: Column<StationRow> = {
  key: "edit",
  header: "Edit",
  value: () => null,
  render: (s) => (
    <Link
      to={href("/registry/stations/:stationId/edit", { stationId: String(s.id) })}
      className={linkClass}
      aria-label={`Edit station ${s.name}`}
    >
      Edit
    </Link>
  ),
};

/** Links to the other sites, when there are several. */
export function SiteChooser({ sites, current }: { sites: { id: number; name: string }[]; current: number }) {
  if (sites.length < 2) return null;
  return (
    <nav aria-label="Sites" className="mb-4 flex flex-wrap gap-2 text-sm">
      {sites.map((s) => (
        <Link
          key={s.id}
          to={overviewHref(s.id)}
          aria-current={s.id === current ? "page" : undefined}
          className={
            s.id === current
              ? "rounded-full bg-night-800 px-3 py-1 font-medium text-white"
              : "rounded-full bg-white px-3 py-1 font-medium ring-1 ring-night-300 hover:bg-night-100"
          }
        >
          {s.name}
        </Link>
      ))}
    </nav>
  );
}

/** An administrator's button in a card's corner. */
export const addButton = (canEdit: boolean, to: string, label: string, variant?: "secondary") =>
  canEdit ? (
    <ButtonLink to={to} variant={variant} size="sm">
      {label}
    </ButtonLink>
  ) : undefined;

export function SiteCard({ registry, canEdit }: { registry: SiteRegistry; canEdit: boolean }) {
  const { site } = registry;
  const edit = href("/registry/sites/:siteId/edit", { siteId: String(site.id) });
  return (
    <Card title={site.name} actions={addButton(canEdit, edit, "Edit site", "secondary")}>
      <FactList
        className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-4 lg:grid-cols-8"
        valueClassName="text-lg font-semibold break-words"
        facts={[
          ["Latitude", `${fmt(site.latitudeDeg, 4)}°`],
          ["Longitude", `${fmt(site.longitudeDeg, 4)}°`],
          ["Altitude", `${fmt(site.altitudeM, 0)} m`],
          ["Minimum elevation", `${fmt(site.minElevationDeg, 1)}°`],
          ["Delay-line stroke", `${fmt(site.delayLineStrokeM, 1)} m`],
          ["Time zone", site.timeZone, true],
          ["Stations", String(registry.stations.length)],
        ]}
      />
    </Card>
  );
}

export function StationMapCard({ registry }: { registry: SiteRegistry }) {
  return (
    <Card title="Station map">
      {registry.stations.length === 0 ? (
        <EmptyState title="No stations yet" />
      ) : (
        <StationMap
          stations={registry.stations.map((s) => ({ name: s.name, eastM: s.eastM, northM: s.northM }))}
          configurations={registry.configurations.map((c) => ({ name: c.name, stationNames: c.stationNames }))}
          layout="side"
          height={520}
        />
      )}
    </Card>
  );
}

export function StationsCard({ registry, canEdit }: { registry: SiteRegistry; canEdit: boolean }) {
  return (
    <Card
      title="Stations"
      actions={addButton(canEdit, withSite(href("/registry/stations/new"), registry.site.id), "Add station")}
    >
      <DataTable
        caption="Stations of the site with east, north, up and path offset in metres"
        columns={canEdit ? [...stationColumns, editStationColumn] : stationColumns}
        rows={registry.stations}
        exportName="stations"
      />
    </Card>
  );
}
