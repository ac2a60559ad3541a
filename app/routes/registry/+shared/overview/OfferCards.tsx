/** The registry page's cards about what the site offers: configurations, instruments and bands, downloads. */
import { href, Link } from "react-router";
import { Card, type Column, DataTable, EmptyState } from "~/components/ui";
import type { SiteRegistry } from "~/services/registry/queries.server";
import { bandColumns as bandFigures } from "../columns";
import { instrumentHref, withSite } from "../links";
import { linkClass, OfferedBadge } from "../RegistryBits";
import { addButton } from "./SiteCards";

type BandRow = SiteRegistry["instruments"][number]["bands"][number] & {
  instrument: string;
  instrumentId: number;
  maxTelescopes: number;
};

const microns = (m: number) => Math.round(m * 1e6 * 1000) / 1000;

const bandColumns: Column<BandRow>[] = [
  { key: "instrument", header: "Instrument", value: (b) => b.instrument },
  { key: "telescopes", header: "Telescopes", align: "right", value: (b) => b.maxTelescopes },
  { key: "band", header: "Band", value: (b) => b.name },
  ...bandFigures<BandRow>(microns),
];

type Props = { registry: SiteRegistry; canEdit: boolean };

export function ConfigurationsCard({ registry, canEdit, offeredIn }: Props & { offeredIn: Record<number, string[]> }) {
  const widest = registry.instruments.reduce((m, i) => Math.max(m, i.maxTelescopes), 0);
  const add = withSite(href("/registry/configurations/new"), registry.site.id);
  return (
    <Card title="Configurations" actions={addButton(canEdit, add, "Add configuration")}>
      {registry.configurations.length === 0 ? (
        <EmptyState title="No configurations yet" />
      ) : (
        <ul className="grid gap-3 md:grid-cols-3">
          {registry.configurations.map((c) => (
            <li key={c.id} className="rounded-lg bg-night-50 p-4 ring-1 ring-night-200">
              <div className="flex items-center justify-between gap-2">
                <h3 className="font-semibold">{c.name}</h3>
                <span className="flex items-center gap-2">
                  <OfferedBadge offered={c.offered} />
                  {canEdit ? (
                    <Link
                      to={href("/registry/configurations/:configurationId/edit", { configurationId: String(c.id) })}
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
                <span className="font-medium">{offeredIn[c.id]?.join(", ") || "none yet"}</span>
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
  );
}

export function InstrumentsCard({ registry, canEdit }: Props) {
  const bandRows: BandRow[] = registry.instruments.flatMap((i) =>
    i.bands.map((b) => ({ ...b, instrument: i.name, instrumentId: i.id, maxTelescopes: i.maxTelescopes })),
  );
  const add = withSite(href("/registry/instruments/new"), registry.site.id);
  return (
    <Card title="Instruments and bands" actions={addButton(canEdit, add, "Add instrument")}>
      {canEdit && registry.instruments.length > 0 ? (
        <p className="mb-3 flex flex-wrap gap-x-4 gap-y-1 text-sm">
          <span className="text-night-600">Edit an instrument and its bands:</span>
          {registry.instruments.map((i) => (
            <Link key={i.id} to={instrumentHref(i.id)} className={linkClass} aria-label={`Edit instrument ${i.name}`}>
              {i.name}
            </Link>
          ))}
        </p>
      ) : null}
      <DataTable
        caption="Instrument bands"
        columns={bandColumns}
        rows={bandRows}
        exportName="bands"
        empty="No instruments yet."
      />
    </Card>
  );
}

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

/** The registry's files; `siteId` names the site when there are several. */
export function DownloadCard({ siteId }: { siteId: number | null }) {
  return (
    <Card title="Download">
      <ul className="grid gap-2 text-sm sm:grid-cols-2 lg:grid-cols-3">
        {EXPORTS.map((e) => (
          <li key={e.file}>
            <a href={withSite(href("/registry/export/:file", { file: e.file }), siteId)} download className={linkClass}>
              {e.label}
            </a>
            <span className="block text-night-600">{e.what}</span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
