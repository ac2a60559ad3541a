import { href, Link } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { ButtonLink, Card, type Column, DataTable, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { getViewer } from "~/lib/guards.server";
import { idParam, invariantResponse } from "~/lib/not-found";
import { stationWithRegistry } from "~/services/registry/queries.server";
import { fixedColumn, stationColumn } from "../+shared/columns";
import { overviewHref } from "../+shared/links";
import { FactList, linkClass, OfferedBadge } from "../+shared/RegistryBits";
import { StationMap } from "../+shared/StationMap";
import type { Route } from "./+types/station";

export async function loader({ request, params, context }: Route.LoaderArgs) {
  // Public, like the whole registry ("registry:read" is granted to everyone); edit links for admins.
  const viewer = await getViewer(request);
  const found = await stationWithRegistry(context.get(dbContext), { stationId: idParam(params.stationId, "station") });
  invariantResponse(found, "There is no station with that number.");
  const { registry, station } = found;
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

type Point = { id: number; name: string; eastM: number; northM: number; upM: number };
type BaselineRow = { id: number; name: string; lengthM: number; groundM: number; paDeg: number } & Record<
  "dE" | "dN" | "dU",
  number
>;

/** The baselines from one station to every other, shortest first: metres, direction east of north. */
function baselinesFrom(station: Point, stations: Point[]): BaselineRow[] {
  return stations
    .filter((s) => s.id !== station.id)
    .map((s) => {
      const dE = s.eastM - station.eastM;
      const dN = s.northM - station.northM;
      const dU = s.upM - station.upM;
      const groundM = Math.hypot(dE, dN);
      const paDeg = ((Math.atan2(dE, dN) * 180) / Math.PI + 360) % 360;
      return { id: s.id, name: s.name, dE, dN, dU, groundM, lengthM: Math.hypot(dE, dN, dU), paDeg };
    })
    .sort((a, b) => a.lengthM - b.lengthM);
}

const baselineColumns: Column<BaselineRow>[] = [
  stationColumn("to", "To station"),
  fixedColumn("length", "Length", "m", (b) => b.lengthM, 2, true),
  fixedColumn("ground", "On the ground", "m", (b) => b.groundM, 2, true),
  fixedColumn("pa", "Direction, east of north", "°", (b) => b.paDeg, 1, true),
  fixedColumn("de", "East", "m", (b) => b.dE, 2, true),
  fixedColumn("dn", "North", "m", (b) => b.dN, 2, true),
  fixedColumn("du", "Up", "m", (b) => b.dU, 2, true),
];

type Loaded = Route.ComponentProps["loaderData"];

function PositionCard({ station }: { station: Loaded["station"] }) {
  const m = (x: number, digits = 3) => `${x.toFixed(digits)} m`;
  return (
    <Card title="Position">
      <FactList
        className="grid grid-cols-2 gap-x-6 gap-y-3"
        valueClassName="font-semibold"
        facts={[
          ["East", m(station.eastM)],
          ["North", m(station.northM)],
          ["Up", m(station.upM)],
          ["Path offset", m(station.pathOffsetM)],
          ["From the reference point", m(Math.hypot(station.eastM, station.northM), 1)],
        ]}
      />
    </Card>
  );
}

/** The configurations the station is in, with their size and whether they are offered. */
function UsedByCard({ usedBy }: { usedBy: Loaded["configurations"] }) {
  return (
    <Card title="In configurations">
      {usedBy.length === 0 ? (
        <p className="text-sm text-night-600">No configuration uses this station.</p>
      ) : (
        <ul className="space-y-2">
          {usedBy.map((c) => (
            <li key={c.name} className="flex items-center justify-between gap-2 text-sm">
              <span className="font-medium">{c.name}</span>
              <span className="text-night-600">
                {c.stationNames.length} stations <OfferedBadge offered={c.offered} />
              </span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

export default function StationPage({ loaderData }: Route.ComponentProps) {
  const { station, stations, configurations, site, canEdit } = loaderData;
  const usedBy = configurations.filter((c) => c.stationNames.includes(station.name));
  return (
    <>
      <PageHeader
        title={`Station ${station.name}`}
        lead={
          <>
            A station of{" "}
            <Link to={overviewHref(site.id)} className={linkClass}>
              {site.name}
            </Link>
            .
          </>
        }
        actions={
          canEdit ? (
            <ButtonLink
              to={href("/registry/stations/:stationId/edit", { stationId: String(station.id) })}
              variant="secondary"
            >
              Edit station
            </ButtonLink>
          ) : undefined
        }
      />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
        <div className="grid content-start gap-6">
          <PositionCard station={station} />
          <UsedByCard usedBy={usedBy} />
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
          rows={baselinesFrom(station, stations)}
          exportName={`baselines-${station.name}`}
        />
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
