import { data, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { registryPaths } from "~/components/registry/paths";
import { StationMap } from "~/components/registry/StationMap";
import { Badge, ButtonLink, Card, type Column, DataTable, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { getViewer } from "~/lib/guards.server";
import { idParam } from "~/services/registry/admin.server";
import { loadSiteRegistry, stationSiteId } from "~/services/registry/queries.server";
import type { Route } from "./+types/station";

export async function loader({ request, params }: Route.LoaderArgs) {
  // Public, like the whole registry ("registry:read" is granted to everyone); edit links for admins.
  const viewer = await getViewer(request);
  const db = database();
  const stationId = idParam(params.stationId, "station");
  const siteId = await stationSiteId(db, stationId);
  const registry = siteId === null ? null : await loadSiteRegistry(db, siteId);
  const station = registry?.stations.find((s) => s.id === stationId);
  if (!registry || !station) throw data("There is no station with that number.", { status: 404 });
  return {
    canEdit: !!viewer?.permissions.has("registry:edit"),
    site: { id: registry.site.id, name: registry.site.name },
    station,
    stations: registry.stations.map((s) => ({ id: s.id, name: s.name, eastM: s.eastM, northM: s.northM, upM: s.upM })),
    configurations: registry.configurations.map((c) => ({
      name: c.name,
      offered: c.offered,
      stationNames: c.stationNames,
    })),
  };
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Station ${d?.station.name ?? ""} — Array registry — Fringe Docket` },
];

type BaselineRow = {
  id: number;
  name: string;
  lengthM: number;
  groundM: number;
  paDeg: number;
  dE: number;
  dN: number;
  dU: number;
};

const fixed = (x: number, digits: number) => x.toFixed(digits);

const baselineColumns: Column<BaselineRow>[] = [
  {
    key: "to",
    header: "To station",
    value: (b) => b.name,
    render: (b) => (
      <Link to={registryPaths.station(b.id)} className="font-medium text-ember-800 underline-offset-2 hover:underline">
        {b.name}
      </Link>
    ),
  },
  {
    key: "length",
    header: "Length",
    unit: "m",
    align: "right",
    value: (b) => Math.round(b.lengthM * 100) / 100,
    render: (b) => fixed(b.lengthM, 2),
  },
  {
    key: "ground",
    header: "On the ground",
    unit: "m",
    align: "right",
    value: (b) => Math.round(b.groundM * 100) / 100,
    render: (b) => fixed(b.groundM, 2),
  },
  {
    key: "pa",
    header: "Direction, east of north",
    unit: "°",
    align: "right",
    value: (b) => Math.round(b.paDeg * 10) / 10,
    render: (b) => fixed(b.paDeg, 1),
  },
  {
    key: "de",
    header: "East",
    unit: "m",
    align: "right",
    value: (b) => Math.round(b.dE * 100) / 100,
    render: (b) => fixed(b.dE, 2),
  },
  {
    key: "dn",
    header: "North",
    unit: "m",
    align: "right",
    value: (b) => Math.round(b.dN * 100) / 100,
    render: (b) => fixed(b.dN, 2),
  },
  {
    key: "du",
    header: "Up",
    unit: "m",
    align: "right",
    value: (b) => Math.round(b.dU * 100) / 100,
    render: (b) => fixed(b.dU, 2),
  },
];

export default function StationPage({ loaderData }: Route.ComponentProps) {
  const { station, stations, configurations, site, canEdit } = loaderData;
  const usedBy = configurations.filter((c) => c.stationNames.includes(station.name));
  const baselines: BaselineRow[] = stations
    .filter((s) => s.id !== station.id)
    .map((s) => {
      const dE = s.eastM - station.eastM;
      const dN = s.northM - station.northM;
      const dU = s.upM - station.upM;
      return {
        id: s.id,
        name: s.name,
        dE,
        dN,
        dU,
        groundM: Math.hypot(dE, dN),
        lengthM: Math.hypot(dE, dN, dU),
        paDeg: ((Math.atan2(dE, dN) * 180) / Math.PI + 360) % 360,
      };
    })
    .sort((a, b) => a.lengthM - b.lengthM);
  return (
    <>
      <PageHeader
        title={`Station ${station.name}`}
        lead={
          <>
            A station of{" "}
            <Link
              to={registryPaths.overview(site.id)}
              className="font-medium text-ember-800 underline-offset-2 hover:underline"
            >
              {site.name}
            </Link>
            .
          </>
        }
        actions={
          canEdit ? (
            <ButtonLink to={registryPaths.editStation(station.id)} variant="secondary">
              Edit station
            </ButtonLink>
          ) : undefined
        }
      />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
        <div className="grid content-start gap-6">
          <Card title="Position">
            <dl className="grid grid-cols-2 gap-x-6 gap-y-3">
              {[
                ["East", `${fixed(station.eastM, 3)} m`],
                ["North", `${fixed(station.northM, 3)} m`],
                ["Up", `${fixed(station.upM, 3)} m`],
                ["Path offset", `${fixed(station.pathOffsetM, 3)} m`],
                ["From the reference point", `${fixed(Math.hypot(station.eastM, station.northM), 1)} m`],
              ].map(([k, val]) => (
                <div key={k}>
                  <dt className="text-sm text-night-600">{k}</dt>
                  <dd className="num font-semibold">{val}</dd>
                </div>
              ))}
            </dl>
          </Card>
          <Card title="In configurations">
            {usedBy.length === 0 ? (
              <p className="text-sm text-night-600">No configuration uses this station.</p>
            ) : (
              <ul className="space-y-2">
                {usedBy.map((c) => (
                  <li key={c.name} className="flex items-center justify-between gap-2 text-sm">
                    <span className="font-medium">{c.name}</span>
                    <span className="text-night-600">
                      {c.stationNames.length} stations{" "}
                      {c.offered ? <Badge tone="ok">offered</Badge> : <Badge>not offered</Badge>}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </Card>
        </div>
        <Card title="Site plan">
          <StationMap
            stations={stations}
            configurations={configurations}
            initialConfiguration={usedBy[0]?.name ?? null}
            focus={station.name}
            frame={stations.filter((s) => s.name === station.name || usedBy[0]?.stationNames.includes(s.name))}
            height={440}
            label={`Site plan with station ${station.name} ringed`}
          />
        </Card>
      </div>
      <Card title={`Baselines from ${station.name}`} className="mt-6">
        <DataTable
          caption={`Baselines from ${station.name} to every other station: length, direction and east, north, up differences in metres`}
          columns={baselineColumns}
          rows={baselines}
          rowKey={(b) => b.id}
          exportName={`baselines-${station.name}`}
        />
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
