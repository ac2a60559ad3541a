/** What a whole-registry import would do: the site, then its stations, configurations, instruments and bands. */
import type { ReactNode } from "react";
import { type Column, DataTable } from "~/components/ui";
import type {
  BandLine,
  Change,
  ConfigurationLine,
  InstrumentLine,
  RegistryPlan,
  SiteLine,
} from "~/services/registry/plan";
import {
  type BandRecord,
  type ConfigurationRecord,
  metresToMicrons,
  type SiteRecord,
} from "~/services/registry/schemas";
import { CHANGE, ChangeBadge, ChangeCounts, changeColumn, lineColumns, num, Value } from "./ChangeParts";
import { StationPreview } from "./StationPreview";

const SITE_FIGURES: [keyof SiteRecord, string][] = [
  ["latitudeDeg", "Latitude (°)"],
  ["longitudeDeg", "Longitude (°)"],
  ["altitudeM", "Altitude (m)"],
  ["minElevationDeg", "Minimum elevation (°)"],
  ["delayLineStrokeM", "Delay-line stroke (m)"],
  ["timeZone", "Time zone"],
];

function SiteSummary({ line }: { line: SiteLine }) {
  const s = line.after!;
  return (
    <div className="space-y-2">
      <p className="flex items-center gap-2">
        <span className="font-semibold">{line.name}</span> <ChangeBadge change={line.change} />
      </p>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-3">
        {SITE_FIGURES.map(([key, label]) => (
          <div key={key}>
            <dt className="text-night-600">{label}</dt>
            <dd className="num">
              <Value before={line.before?.[key]} after={s[key]} changed={line.changed.includes(key)} format={String} />
            </dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

const configurationColumn = <K extends keyof ConfigurationRecord & string>(
  key: K,
  header: string,
  format: (x: ConfigurationRecord[K]) => string,
  value: (c: ConfigurationRecord | null) => string,
) =>
  changeColumn<ConfigurationLine, ConfigurationRecord, K>(key, header, key, format, {
    value: (l) => value(l.after ?? l.before),
  });

const configurationColumns: Column<ConfigurationLine>[] = [
  ...lineColumns<ConfigurationLine>("Configuration"),
  configurationColumn(
    "stations",
    "Stations, in order",
    (x) => x.join(" "),
    (c) => c?.stations.join(" ") ?? "",
  ),
  configurationColumn(
    "offered",
    "Offered",
    (x) => (x ? "yes" : "no"),
    (c) => String(c?.offered ?? ""),
  ),
  configurationColumn(
    "description",
    "Description",
    (x) => x || "—",
    (c) => c?.description ?? "",
  ),
];

type BandRow = BandLine & { instrument: string; instrumentChange: Change; maxTelescopes: ReactNode };

const band = <K extends keyof BandRecord & string>(
  key: string,
  header: string,
  field: K,
  options: { unit?: string; value?: (b: BandRow) => number } = {},
) => changeColumn<BandRow, BandRecord, K>(key, header, field, (x) => String(x), { align: "right", ...options });

const microns = (field: "centralWavelengthM" | "bandwidthM") => ({
  unit: "µm",
  value: (b: BandRow) => metresToMicrons((b.after ?? b.before)![field]),
});

const bandColumns: Column<BandRow>[] = [
  {
    key: "instrument",
    header: "Instrument",
    value: (b) => b.instrument,
    render: (b) => <span className="font-medium">{b.instrument}</span>,
  },
  { key: "telescopes", header: "Telescopes", align: "right", value: () => null, render: (b) => b.maxTelescopes },
  { key: "band", header: "Band", value: (b) => b.name },
  {
    key: "change",
    header: "Change",
    value: (b) => CHANGE[b.change].label,
    render: (b) => <ChangeBadge change={b.change} />,
  },
  {
    ...band("wavelength", "Central wavelength", "centralWavelengthM", microns("centralWavelengthM")),
    render: (b) => <MicronValue line={b} field="centralWavelengthM" />,
  },
  {
    ...band("bandwidth", "Bandwidth", "bandwidthM", microns("bandwidthM")),
    render: (b) => <MicronValue line={b} field="bandwidthM" />,
  },
  band("channels", "Channels", "channels"),
  band("limit", "Limiting magnitude", "limitingMagnitude", { unit: "mag" }),
];

function MicronValue({ line, field }: { line: BandLine; field: "centralWavelengthM" | "bandwidthM" }) {
  return (
    <Value
      before={line.before?.[field]}
      after={line.after?.[field]}
      changed={line.changed.includes(field)}
      format={(x) => String(metresToMicrons(x))}
    />
  );
}

/** One row per band with its instrument's telescopes (and change); an instrument without bands gets one row. */
function bandRows(instruments: InstrumentLine[]): BandRow[] {
  return instruments.flatMap((i) => {
    const telescopes = (
      <span key={i.name} className="inline-flex items-center gap-1.5">
        <Value
          before={i.before?.maxTelescopes}
          after={i.after?.maxTelescopes}
          changed={i.changed.includes("maxTelescopes")}
          format={num}
        />
        {i.change === "new" || i.change === "updated" ? <ChangeBadge change={i.change} /> : null}
      </span>
    );
    const of = { instrument: i.name, instrumentChange: i.change, maxTelescopes: telescopes };
    const rows: BandRow[] = i.bands.map((b) => ({ ...b, ...of }));
    const none: BandRow = { row: null, name: "—", change: i.change, before: null, after: null, changed: [], ...of };
    return rows.length > 0 ? rows : [none];
  });
}

function PreviewSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="space-y-3 border-t border-night-200 pt-4 first:border-t-0 first:pt-0">
      <h3 className="text-base font-semibold">{title}</h3>
      <div className="space-y-3">{children}</div>
    </section>
  );
}

export function RegistryPreview({ plan }: { plan: RegistryPlan }) {
  return (
    <div className="grid grid-cols-1 gap-6">
      <PreviewSection title="Site">
        <SiteSummary line={plan.site} />
      </PreviewSection>
      <PreviewSection title="Stations">
        <StationPreview lines={plan.stations} counts={plan.counts.stations} />
      </PreviewSection>
      <PreviewSection title="Configurations">
        <p className="text-sm">
          <ChangeCounts counts={plan.counts.configurations} noun="Configurations" />
        </p>
        <DataTable
          caption="What the import would do to each configuration"
          columns={configurationColumns}
          rows={plan.configurations}
          rowKey={(l) => l.name}
          empty="No configurations."
        />
      </PreviewSection>
      <PreviewSection title="Instruments and bands">
        <p className="flex flex-wrap gap-4 text-sm">
          <ChangeCounts counts={plan.counts.instruments} noun="Instruments" />
          <ChangeCounts counts={plan.counts.bands} noun="Bands" />
        </p>
        <DataTable
          caption="What the import would do to each instrument band"
          columns={bandColumns}
          rows={bandRows(plan.instruments)}
          rowKey={(b) => `${b.instrument}-${b.name}`}
          empty="No instruments."
        />
      </PreviewSection>
    </div>
  );
}
