import { data } from "react-router";
import type { Route } from "./+types/overview";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, Card, DataTable, EmptyState, PageHeader, type Column } from "~/components/ui";
import { database } from "~/db/client.server";
import { listSites, loadSiteRegistry, type SiteRegistry } from "~/services/registry.server";

export async function loader(_: Route.LoaderArgs) {
  // The registry is public ("registry:read" is granted to everyone).
  const db = database();
  const [first] = await listSites(db);
  if (!first) return { registry: null };
  const registry = await loadSiteRegistry(db, first.id);
  if (!registry) throw data("The site was removed while loading.", { status: 404 });
  return { registry };
}

export const meta: Route.MetaFunction = () => [{ title: "Array registry — Fringe Docket" }];

type StationRow = SiteRegistry["stations"][number];
type BandRow = SiteRegistry["instruments"][number]["bands"][number] & { instrument: string };

const fmt = (x: number, digits: number) => x.toFixed(digits);

const stationColumns: Column<StationRow>[] = [
  { key: "name", header: "Station", value: (s) => s.name },
  { key: "east", header: "East", unit: "m", align: "right", value: (s) => s.eastM, render: (s) => fmt(s.eastM, 2) },
  { key: "north", header: "North", unit: "m", align: "right", value: (s) => s.northM, render: (s) => fmt(s.northM, 2) },
  { key: "up", header: "Up", unit: "m", align: "right", value: (s) => s.upM, render: (s) => fmt(s.upM, 2) },
  {
    key: "offset",
    header: "Path offset",
    unit: "m",
    align: "right",
    value: (s) => s.pathOffsetM,
    render: (s) => fmt(s.pathOffsetM, 2),
  },
  {
    key: "radius",
    header: "Distance from centre",
    unit: "m",
    align: "right",
    value: (s) => Math.round(Math.hypot(s.eastM, s.northM) * 10) / 10,
  },
];

const bandColumns: Column<BandRow>[] = [
  { key: "instrument", header: "Instrument", value: (b) => b.instrument },
  { key: "band", header: "Band", value: (b) => b.name },
  {
    key: "wavelength",
    header: "Central wavelength",
    unit: "µm",
    align: "right",
    value: (b) => Math.round(b.centralWavelengthM * 1e6 * 1000) / 1000,
  },
  { key: "bandwidth", header: "Bandwidth", unit: "µm", align: "right", value: (b) => Math.round(b.bandwidthM * 1e6 * 1000) / 1000 },
  { key: "channels", header: "Channels", align: "right", value: (b) => b.channels },
  { key: "limit", header: "Limiting magnitude", unit: "mag", align: "right", value: (b) => b.limitingMagnitude },
];

export default function RegistryOverview({ loaderData }: Route.ComponentProps) {
  const { registry } = loaderData;
  if (!registry) {
    return (
      <>
        <PageHeader title="Array registry" />
        <EmptyState title="No site registered yet">An administrator adds the site, its stations and instruments.</EmptyState>
      </>
    );
  }
  const { site } = registry;
  const bandRows: BandRow[] = registry.instruments.flatMap((i) => i.bands.map((b) => ({ ...b, instrument: i.name })));
  return (
    <>
      <PageHeader
        title="Array registry"
        lead="The site, its stations, the configurations on offer and the instruments. Everyone can read it; administrators keep it current."
      />
      <div className="grid gap-6">
        <Card title={site.name}>
          <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-3 lg:grid-cols-6">
            {[
              ["Latitude", `${fmt(site.latitudeDeg, 4)}°`],
              ["Longitude", `${fmt(site.longitudeDeg, 4)}°`],
              ["Altitude", `${fmt(site.altitudeM, 0)} m`],
              ["Minimum elevation", `${fmt(site.minElevationDeg, 1)}°`],
              ["Delay-line stroke", `${fmt(site.delayLineStrokeM, 1)} m`],
              ["Stations", String(registry.stations.length)],
            ].map(([k, val]) => (
              <div key={k}>
                <dt className="text-sm text-night-600">{k}</dt>
                <dd className="num text-lg font-semibold">{val}</dd>
              </div>
            ))}
          </dl>
        </Card>

        <Card title="Configurations">
          {registry.configurations.length === 0 ? (
            <EmptyState title="No configurations yet" />
          ) : (
            <ul className="grid gap-3 md:grid-cols-3">
              {registry.configurations.map((c) => (
                <li key={c.id} className="rounded-lg bg-night-50 p-4 ring-1 ring-night-200">
                  <div className="flex items-center justify-between gap-2">
                    <h3 className="font-semibold">{c.name}</h3>
                    {c.offered ? <Badge tone="ok">offered</Badge> : <Badge>not offered</Badge>}
                  </div>
                  <p className="mt-1 text-sm text-night-700">{c.description}</p>
                  <p className="mt-2 text-sm">
                    <span className="text-night-600">Stations:</span> <span className="font-medium">{c.stationNames.join(" · ")}</span>
                  </p>
                </li>
              ))}
            </ul>
          )}
        </Card>

        <Card title="Stations">
          <DataTable
            caption="Stations of the site with east, north, up and path offset in metres"
            columns={stationColumns}
            rows={registry.stations}
            rowKey={(s) => s.id}
            exportName="stations"
          />
        </Card>

        <Card title="Instruments and bands">
          <DataTable caption="Instrument bands" columns={bandColumns} rows={bandRows} rowKey={(b) => b.id} exportName="bands" />
        </Card>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
