import { Card, type Column, DataTable, DetailList } from "~/components/ui";
import { lstText, moonPhaseText, type NightSkySummary, type SkyEvent, utcTime } from "~/services/nights/sky";

const columns: Column<SkyEvent>[] = [
  { key: "event", header: "Event", rowHeader: true, className: "whitespace-nowrap", value: (e) => e.label },
  {
    key: "utc",
    header: "UT",
    align: "right",
    className: "whitespace-nowrap",
    value: (e) => e.utc,
    render: (e) => (e.utc ? `${e.utc.slice(0, 10)} ${utcTime(e.utc)}` : "—"),
  },
  { key: "local", header: "Local", align: "right", className: "whitespace-nowrap", value: (e) => e.local },
  {
    key: "lst",
    header: "LST",
    align: "right",
    className: "whitespace-nowrap",
    value: (e) => e.lstH,
    render: (e) => (e.lstH === null ? "—" : lstText(e.lstH)),
  },
];

/** Sunset, twilights and sunrise in UT, local time and LST; the Moon; the configuration. */
export function SkyCard({
  sky,
  configuration,
  stationNames,
  siteName,
}: {
  sky: NightSkySummary;
  configuration: string | null;
  stationNames: string[];
  siteName: string;
}) {
  return (
    <Card title="The sky of the night">
      <DetailList
        className="mb-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-4"
        items={[
          { label: "Site", value: `${siteName} (times local to ${sky.timeZone})` },
          {
            label: "Configuration",
            value: configuration
              ? `${configuration}${stationNames.length ? ` — ${stationNames.join(", ")}` : ""}`
              : "none installed",
          },
          { label: "Astronomical darkness", value: <span className="num">{sky.darkHours.toFixed(2)} h</span> },
          {
            label: "Moon",
            value: (
              <span>
                {moonPhaseText(sky.moon.illuminatedFraction, sky.moon.waxing)}; rises{" "}
                {sky.moon.riseUtc ? `${utcTime(sky.moon.riseUtc)} (${sky.moon.riseLocal})` : "not this night"}, sets{" "}
                {sky.moon.setUtc ? `${utcTime(sky.moon.setUtc)} (${sky.moon.setLocal})` : "not this night"}
              </span>
            ),
          },
        ]}
      />
      <DataTable
        columns={columns}
        rows={sky.events}
        caption="Sun events of the night in UT, local time and local sidereal time"
        exportName={`sun-events-${sky.date}`}
        density="compact"
      />
    </Card>
  );
}
