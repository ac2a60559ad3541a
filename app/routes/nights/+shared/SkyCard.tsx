import { Card, DetailList } from "~/components/ui";
import { lstText, moonPhaseText, type NightSkySummary, utcTime } from "~/services/nights/sky";

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
      <div className="relative overflow-x-auto rounded-lg ring-1 ring-night-200">
        <table className="min-w-full divide-y divide-night-200 bg-white text-sm">
          <caption className="sr-only">Sun events of the night in UT, local time and local sidereal time</caption>
          <thead className="bg-night-100/70">
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Event
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                UT
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Local
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                LST
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-night-100">
            {sky.events.map((e) => (
              <tr key={e.key}>
                <th scope="row" className="whitespace-nowrap px-3 py-1.5 text-left font-normal">
                  {e.label}
                </th>
                <td className="num whitespace-nowrap px-3 py-1.5 text-right">
                  {e.utc ? `${e.utc.slice(0, 10)} ${utcTime(e.utc)}` : "—"}
                </td>
                <td className="num whitespace-nowrap px-3 py-1.5 text-right">{e.local ?? "—"}</td>
                <td className="num whitespace-nowrap px-3 py-1.5 text-right">
                  {e.lstH === null ? "—" : lstText(e.lstH)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Card>
  );
}
