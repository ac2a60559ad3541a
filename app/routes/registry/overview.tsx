import { data, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { registryPaths } from "~/components/registry/paths";
import { StationMap } from "~/components/registry/StationMap";
import { Badge, ButtonLink, Card, type Column, DataTable, EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { getViewer } from "~/lib/guards.server";
import { cyclesOfferingConfigurations } from "~/services/cycles/cycles.server";
import { listSites, loadSiteRegistry, type SiteRegistry } from "~/services/registry/queries.server";
import type { Route } from "./+types/overview";

export async function loader({ request, url }: Route.LoaderArgs) {
  // The registry is public ("registry:read" is granted to everyone); administrators also get edit controls.
  const viewer = await getViewer(request);
  const canEdit = !!viewer?.permissions.has("registry:edit");
  const db = database();
  const sites = (await listSites(db)).map((s) => ({ id: s.id, name: s.name }));
  const wanted = url.searchParams.get("site");
  const chosen = wanted ? sites.find((s) => String(s.id) === wanted) : sites[0];
  if (wanted && !chosen) throw data("There is no site with that number.", { status: 404 });
  if (!chosen) return { registry: null, sites, canEdit, offeredIn: {} as Record<number, string[]> };
  const [registry, offeredIn] = await Promise.all([loadSiteRegistry(db, chosen.id), cyclesOfferingConfigurations(db)]);
  if (!registry) throw data("The site was removed while loading.", { status: 404 });
  return { registry, sites, canEdit, offeredIn };
}

export const meta: Route.MetaFunction = () => [{ title: "Array registry — Fringe Docket" }];

type StationRow = SiteRegistry["stations"][number];
type BandRow = SiteRegistry["instruments"][number]["bands"][number] & {
  instrument: string;
  instrumentId: number;
  maxTelescopes: number;
};

const fmt = (x: number, digits: number) => x.toFixed(digits);
const linkClass = "font-medium text-ember-800 underline-offset-2 hover:underline";

const stationColumns: Column<StationRow>[] = [
  {
    key: "name",
    header: "Station",
    value: (s) => s.name,
    render: (s) => (
      <Link to={registryPaths.station(s.id)} className={linkClass}>
        {s.name}
      </Link>
    ),
  },
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

const editStationColumn: Column<StationRow> = {
  key: "edit",
  header: "Edit",
  value: () => null,
  render: (s) => (
    <Link to={registryPaths.editStation(s.id)} className={linkClass} aria-label={`Edit station ${s.name}`}>
      Edit
    </Link>
  ),
};

const bandColumns: Column<BandRow>[] = [
  { key: "instrument", header: "Instrument", value: (b) => b.instrument },
  { key: "telescopes", header: "Telescopes", align: "right", value: (b) => b.maxTelescopes },
  { key: "band", header: "Band", value: (b) => b.name },
  {
    key: "wavelength",
    header: "Central wavelength",
    unit: "µm",
    align: "right",
    value: (b) => Math.round(b.centralWavelengthM * 1e6 * 1000) / 1000,
  },
  {
    key: "bandwidth",
    header: "Bandwidth",
    unit: "µm",
    align: "right",
    value: (b) => Math.round(b.bandwidthM * 1e6 * 1000) / 1000,
  },
  { key: "channels", header: "Channels", align: "right", value: (b) => b.channels },
  { key: "limit", header: "Limiting magnitude", unit: "mag", align: "right", value: (b) => b.limitingMagnitude },
];

const EXPORTS: { file: string; label: string; what: string }[] = [
  { file: "stations.csv", label: "Stations (CSV)", what: "name, east, north, up and path offset in metres" },
  { file: "stations.json", label: "Stations (JSON)", what: "the same, as JSON" },
  { file: "configurations.csv", label: "Configurations (CSV)", what: "name, description, offered, stations in order" },
  { file: "bands.csv", label: "Instruments and bands (CSV)", what: "one row per band, wavelengths in µm" },
  {
    file: "registry.json",
    label: "Whole registry (JSON)",
    what: "everything above; an administrator can import it back",
  },
];

function SiteChooser({ sites, current }: { sites: { id: number; name: string }[]; current: number }) {
  if (sites.length < 2) return null;
  return (
    <nav aria-label="Sites" className="mb-4 flex flex-wrap gap-2 text-sm">
      {sites.map((s) => (
        <Link
          key={s.id}
          to={registryPaths.overview(s.id)}
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

export default function RegistryOverview({ loaderData }: Route.ComponentProps) {
  const { registry, canEdit, sites } = loaderData;
  if (!registry) {
    return (
      <>
        <PageHeader title="Array registry" />
        <EmptyState
          title="No site registered yet"
          action={
            canEdit ? (
              <div className="flex flex-wrap justify-center gap-2">
                <ButtonLink to={registryPaths.newSite()}>Add the site</ButtonLink>
                <ButtonLink to={registryPaths.importPage()} variant="secondary">
                  Import a registry
                </ButtonLink>
              </div>
            ) : undefined
          }
        >
          An administrator adds the site, its stations and instruments.
        </EmptyState>
      </>
    );
  }
  const { site } = registry;
  const bandRows: BandRow[] = registry.instruments.flatMap((i) =>
    i.bands.map((b) => ({ ...b, instrument: i.name, instrumentId: i.id, maxTelescopes: i.maxTelescopes })),
  );
  const widest = registry.instruments.reduce((m, i) => Math.max(m, i.maxTelescopes), 0);
  return (
    <>
      <PageHeader
        title="Array registry"
        lead="The site, its stations, the configurations on offer and the instruments. Everyone can read it; administrators keep it current."
        actions={
          canEdit ? (
            <>
              <ButtonLink to={registryPaths.importPage(site.id)} variant="secondary">
                Import
              </ButtonLink>
              <ButtonLink to={registryPaths.newSite()} variant="secondary">
                Add a site
              </ButtonLink>
            </>
          ) : undefined
        }
      />
      <SiteChooser sites={sites} current={site.id} />
      <div className="grid grid-cols-1 gap-6">
        <Card
          title={site.name}
          actions={
            canEdit ? (
              <ButtonLink to={registryPaths.editSite(site.id)} variant="secondary" size="sm">
                Edit site
              </ButtonLink>
            ) : undefined
          }
        >
          <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-4 lg:grid-cols-8">
            {[
              ["Latitude", `${fmt(site.latitudeDeg, 4)}°`],
              ["Longitude", `${fmt(site.longitudeDeg, 4)}°`],
              ["Altitude", `${fmt(site.altitudeM, 0)} m`],
              ["Minimum elevation", `${fmt(site.minElevationDeg, 1)}°`],
              ["Delay-line stroke", `${fmt(site.delayLineStrokeM, 1)} m`],
              ["Time zone", site.timeZone],
              ["Stations", String(registry.stations.length)],
            ].map(([k, val]) => (
              <div key={k} className={k === "Time zone" ? "col-span-2" : undefined}>
                <dt className="text-sm text-night-600">{k}</dt>
                <dd className="num text-lg font-semibold break-words">{val}</dd>
              </div>
            ))}
          </dl>
        </Card>

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

        <Card
          title="Configurations"
          actions={
            canEdit ? (
              <ButtonLink to={registryPaths.newConfiguration(site.id)} size="sm">
                Add configuration
              </ButtonLink>
            ) : undefined
          }
        >
          {registry.configurations.length === 0 ? (
            <EmptyState title="No configurations yet" />
          ) : (
            <ul className="grid gap-3 md:grid-cols-3">
              {registry.configurations.map((c) => (
                <li key={c.id} className="rounded-lg bg-night-50 p-4 ring-1 ring-night-200">
                  <div className="flex items-center justify-between gap-2">
                    <h3 className="font-semibold">{c.name}</h3>
                    <span className="flex items-center gap-2">
                      {c.offered ? <Badge tone="ok">offered</Badge> : <Badge>not offered</Badge>}
                      {canEdit ? (
                        <Link
                          to={registryPaths.editConfiguration(c.id)}
                          className={`text-sm ${linkClass}`}
                          aria-label={`Edit configuration ${c.name}`}
                        >
                          Edit
                        </Link>
                      ) : null}
                    </span>
                  </div>
                  <p className="mt-1 text-sm text-night-700">{c.description}</p>
                  <p className="mt-2 text-sm">
                    <span className="text-night-600">Stations:</span>{" "}
                    <span className="font-medium">{c.stationNames.join(" · ")}</span>
                  </p>
                  <p className="mt-1 text-sm">
                    <span className="text-night-600">Cycles:</span>{" "}
                    <span className="font-medium">{loaderData.offeredIn[c.id]?.join(", ") || "none yet"}</span>
                  </p>
                  {widest > 0 && c.stationNames.length > widest ? (
                    <p className="mt-2 text-sm font-medium text-caution-700">
                      More stations than any instrument combines ({widest}).
                    </p>
                  ) : null}
                </li>
              ))}
            </ul>
          )}
        </Card>

        <Card
          title="Stations"
          actions={
            canEdit ? (
              <ButtonLink to={registryPaths.newStation(site.id)} size="sm">
                Add station
              </ButtonLink>
            ) : undefined
          }
        >
          <DataTable
            caption="Stations of the site with east, north, up and path offset in metres"
            columns={canEdit ? [...stationColumns, editStationColumn] : stationColumns}
            rows={registry.stations}
            rowKey={(s) => s.id}
            exportName="stations"
          />
        </Card>

        <Card
          title="Instruments and bands"
          actions={
            canEdit ? (
              <ButtonLink to={registryPaths.newInstrument(site.id)} size="sm">
                Add instrument
              </ButtonLink>
            ) : undefined
          }
        >
          {canEdit && registry.instruments.length > 0 ? (
            <p className="mb-3 flex flex-wrap gap-x-4 gap-y-1 text-sm">
              <span className="text-night-600">Edit an instrument and its bands:</span>
              {registry.instruments.map((i) => (
                <Link
                  key={i.id}
                  to={registryPaths.editInstrument(i.id)}
                  className={linkClass}
                  aria-label={`Edit instrument ${i.name}`}
                >
                  {i.name}
                </Link>
              ))}
            </p>
          ) : null}
          <DataTable
            caption="Instrument bands"
            columns={bandColumns}
            rows={bandRows}
            rowKey={(b) => b.id}
            exportName="bands"
            empty="No instruments yet."
          />
        </Card>

        <Card title="Download">
          <ul className="grid gap-2 text-sm sm:grid-cols-2 lg:grid-cols-3">
            {EXPORTS.map((e) => (
              <li key={e.file}>
                <a
                  href={registryPaths.exportFile(e.file, sites.length > 1 ? site.id : null)}
                  download
                  className={linkClass}
                >
                  {e.label}
                </a>
                <span className="block text-night-600">{e.what}</span>
              </li>
            ))}
          </ul>
        </Card>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
