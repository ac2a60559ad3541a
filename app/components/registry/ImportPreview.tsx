/**
 * What an import would change, before anything is written: counts, one line per station (and per
 * configuration, instrument and band for a whole registry), the changed values side by side.
 */
import type { ReactNode } from "react";
import { Badge, type BadgeTone, type Column, DataTable } from "~/components/ui";
import type {
  BandLine,
  Change,
  ConfigurationLine,
  InstrumentLine,
  RegistryPlan,
  SiteLine,
  StationColumn,
  StationLine,
  StationPlan,
} from "~/services/registry/io";
import { metresToMicrons } from "~/services/registry/io";

const CHANGE: Record<Change, { label: string; tone: BadgeTone }> = {
  new: { label: "new", tone: "info" },
  updated: { label: "updated", tone: "caution" },
  unchanged: { label: "unchanged", tone: "neutral" },
  remove: { label: "removed", tone: "danger" },
  keep: { label: "left as is", tone: "neutral" },
};

export function ChangeBadge({ change }: { change: Change }) {
  return <Badge tone={CHANGE[change].tone}>{CHANGE[change].label}</Badge>;
}

export function ChangeCounts({ counts, noun }: { counts: Record<Change, number>; noun: string }) {
  const parts = (Object.keys(CHANGE) as Change[]).filter((c) => counts[c] > 0);
  if (parts.length === 0) return <span className="text-night-600">no {noun}</span>;
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5">
      <span className="font-medium">{noun}:</span>
      {parts.map((c) => (
        <Badge key={c} tone={CHANGE[c].tone}>
          {counts[c]} {CHANGE[c].label}
        </Badge>
      ))}
    </span>
  );
}

/** "12.5" or, when it changes, "12.5 → 13" with the new value marked. */
function Value<T>({
  before,
  after,
  changed,
  format,
}: {
  before: T | undefined;
  after: T | undefined;
  changed: boolean;
  format: (x: T) => string;
}) {
  if (after === undefined) return <span className="text-night-500">{before === undefined ? "—" : format(before)}</span>;
  if (!changed || before === undefined) return <>{format(after)}</>;
  return (
    <span className="whitespace-nowrap">
      <span className="text-night-500 line-through">{format(before)}</span> →{" "}
      <mark className="rounded bg-caution-50 px-1 font-semibold text-caution-700">{format(after)}</mark>
    </span>
  );
}

const num = (x: number) => String(x);

function stationColumn(key: StationColumn, header: string): Column<StationLine> {
  return {
    key,
    header,
    unit: "m",
    align: "right",
    value: (l) => (l.after ?? l.before)?.[key] ?? null,
    render: (l) => (
      <Value
        before={l.before?.[key] as number | undefined}
        after={l.after?.[key] as number | undefined}
        changed={l.changed.includes(key)}
        format={num}
      />
    ),
  };
}

const stationColumns: Column<StationLine>[] = [
  { key: "row", header: "Row", align: "right", value: (l) => l.row },
  {
    key: "name",
    header: "Station",
    value: (l) => l.name,
    render: (l) => <span className="font-medium">{l.name}</span>,
  },
  {
    key: "change",
    header: "Change",
    value: (l) => CHANGE[l.change].label,
    render: (l) => <ChangeBadge change={l.change} />,
  },
  stationColumn("eastM", "East"),
  stationColumn("northM", "North"),
  stationColumn("upM", "Up"),
  stationColumn("pathOffsetM", "Path offset"),
  {
    key: "note",
    header: "Note",
    value: (l) => l.note,
    render: (l) => <span className="text-night-600">{l.note ?? ""}</span>,
  },
];

/** A station of the site that the file does not mention and that nothing happens to. */
const untouched = (l: StationLine) => l.change === "keep" && l.note === "not in the file; left as it is";

/** Unchanged stations are listed inline when few, folded away when many. */
const INLINE_UNCHANGED = 5;

export function StationChanges({ lines }: { lines: StationLine[] }) {
  const unchanged = lines.filter((l) => l.change === "unchanged");
  const foldUnchanged = unchanged.length > INLINE_UNCHANGED;
  const shown = lines.filter((l) => !untouched(l) && !(foldUnchanged && l.change === "unchanged"));
  const quiet = lines.filter(untouched).length;
  return (
    <div className="space-y-2">
      {shown.length > 0 ? (
        <DataTable
          caption="What the import would do to each station"
          columns={stationColumns}
          rows={shown}
          rowKey={(l) => `${l.row ?? "site"}-${l.name}`}
        />
      ) : null}
      {foldUnchanged ? (
        <details className="text-sm">
          <summary className="cursor-pointer font-medium text-night-800">
            {unchanged.length} stations in the file match the registry already
          </summary>
          <div className="mt-2">
            <DataTable
              caption="Stations of the file that are unchanged"
              columns={stationColumns}
              rows={unchanged}
              rowKey={(l) => `${l.row}-${l.name}`}
            />
          </div>
        </details>
      ) : null}
      {quiet > 0 ? (
        <p className="text-sm text-night-600">
          {quiet} station{quiet === 1 ? "" : "s"} of the site {quiet === 1 ? "is" : "are"} not in the file and stay
          {quiet === 1 ? "s" : ""} as {quiet === 1 ? "it is" : "they are"}.
        </p>
      ) : null}
    </div>
  );
}

export function StationPreview({ plan }: { plan: StationPlan }) {
  return (
    <div className="space-y-3">
      <p className="text-sm">
        <ChangeCounts counts={plan.counts} noun="Stations" />
      </p>
      <StationChanges lines={plan.lines} />
    </div>
  );
}

function SiteSummary({ line }: { line: SiteLine }) {
  const s = line.after!;
  const rows: [keyof typeof s, string, (x: never) => string][] = [
    ["latitudeDeg", "Latitude (°)", num as (x: never) => string],
    ["longitudeDeg", "Longitude (°)", num as (x: never) => string],
    ["altitudeM", "Altitude (m)", num as (x: never) => string],
    ["minElevationDeg", "Minimum elevation (°)", num as (x: never) => string],
    ["delayLineStrokeM", "Delay-line stroke (m)", num as (x: never) => string],
    ["timeZone", "Time zone", String as (x: never) => string],
  ];
  return (
    <div className="space-y-2">
      <p className="flex items-center gap-2">
        <span className="font-semibold">{line.name}</span> <ChangeBadge change={line.change} />
      </p>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-3">
        {rows.map(([key, label, format]) => (
          <div key={key}>
            <dt className="text-night-600">{label}</dt>
            <dd className="num">
              <Value
                before={line.before?.[key] as never}
                after={s[key] as never}
                changed={line.changed.includes(key)}
                format={format}
              />
            </dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

const configurationColumns: Column<ConfigurationLine>[] = [
  { key: "row", header: "Row", align: "right", value: (l) => l.row },
  {
    key: "name",
    header: "Configuration",
    value: (l) => l.name,
    render: (l) => <span className="font-medium">{l.name}</span>,
  },
  {
    key: "change",
    header: "Change",
    value: (l) => CHANGE[l.change].label,
    render: (l) => <ChangeBadge change={l.change} />,
  },
  {
    key: "stations",
    header: "Stations, in order",
    value: (l) => (l.after ?? l.before)?.stations.join(" ") ?? "",
    render: (l) => (
      <Value
        before={l.before?.stations}
        after={l.after?.stations}
        changed={l.changed.includes("stations")}
        format={(x) => x.join(" ")}
      />
    ),
  },
  {
    key: "offered",
    header: "Offered",
    value: (l) => String((l.after ?? l.before)?.offered ?? ""),
    render: (l) => (
      <Value
        before={l.before?.offered}
        after={l.after?.offered}
        changed={l.changed.includes("offered")}
        format={(x) => (x ? "yes" : "no")}
      />
    ),
  },
  {
    key: "description",
    header: "Description",
    value: (l) => (l.after ?? l.before)?.description ?? "",
    render: (l) => (
      <Value
        before={l.before?.description}
        after={l.after?.description}
        changed={l.changed.includes("description")}
        format={(x) => x || "—"}
      />
    ),
  },
];

type BandRow = BandLine & { instrument: string; instrumentChange: Change; maxTelescopes: ReactNode };

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
    key: "wavelength",
    header: "Central wavelength",
    unit: "µm",
    align: "right",
    value: (b) => metresToMicrons((b.after ?? b.before)!.centralWavelengthM),
    render: (b) => (
      <Value
        before={b.before?.centralWavelengthM}
        after={b.after?.centralWavelengthM}
        changed={b.changed.includes("centralWavelengthM")}
        format={(x) => String(metresToMicrons(x))}
      />
    ),
  },
  {
    key: "bandwidth",
    header: "Bandwidth",
    unit: "µm",
    align: "right",
    value: (b) => metresToMicrons((b.after ?? b.before)!.bandwidthM),
    render: (b) => (
      <Value
        before={b.before?.bandwidthM}
        after={b.after?.bandwidthM}
        changed={b.changed.includes("bandwidthM")}
        format={(x) => String(metresToMicrons(x))}
      />
    ),
  },
  {
    key: "channels",
    header: "Channels",
    align: "right",
    value: (b) => (b.after ?? b.before)!.channels,
    render: (b) => (
      <Value
        before={b.before?.channels}
        after={b.after?.channels}
        changed={b.changed.includes("channels")}
        format={num}
      />
    ),
  },
  {
    key: "limit",
    header: "Limiting magnitude",
    unit: "mag",
    align: "right",
    value: (b) => (b.after ?? b.before)!.limitingMagnitude,
    render: (b) => (
      <Value
        before={b.before?.limitingMagnitude}
        after={b.after?.limitingMagnitude}
        changed={b.changed.includes("limitingMagnitude")}
        format={num}
      />
    ),
  },
];

function bandRows(instruments: InstrumentLine[]): BandRow[] {
  return instruments.flatMap((i) => {
    const telescopes = (
      <span className="inline-flex items-center gap-1.5">
        <Value
          before={i.before?.maxTelescopes}
          after={i.after?.maxTelescopes}
          changed={i.changed.includes("maxTelescopes")}
          format={num}
        />
        {i.change === "new" || i.change === "updated" ? <ChangeBadge change={i.change} /> : null}
      </span>
    );
    const rows = i.bands.map((b) => ({
      ...b,
      instrument: i.name,
      instrumentChange: i.change,
      maxTelescopes: telescopes,
    }));
    return rows.length > 0
      ? rows
      : [
          {
            row: null,
            name: "—",
            change: i.change,
            before: null,
            after: null,
            changed: [],
            instrument: i.name,
            instrumentChange: i.change,
            maxTelescopes: telescopes,
          } as unknown as BandRow,
        ];
  });
}

function PreviewSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="space-y-3 border-t border-night-200 pt-4 first:border-t-0 first:pt-0">
      <h3 className="text-base font-semibold">{title}</h3>
      {children}
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
        <div className="space-y-3">
          <p className="text-sm">
            <ChangeCounts counts={plan.counts.stations} noun="Stations" />
          </p>
          <StationChanges lines={plan.stations} />
        </div>
      </PreviewSection>
      <PreviewSection title="Configurations">
        <div className="space-y-3">
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
        </div>
      </PreviewSection>
      <PreviewSection title="Instruments and bands">
        <div className="space-y-3">
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
        </div>
      </PreviewSection>
    </div>
  );
}
