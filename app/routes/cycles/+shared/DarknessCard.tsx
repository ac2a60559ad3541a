/** Nights per configuration and the hours of darkness they give over the cycle (engine: Sun below −18°). */
import { Card, type Column, DataTable, fixedColumn } from "~/components/ui";

type Darkness = {
  sites: { name: string; periodNights: number; meanDarkHoursPerNight: number; shortestH: number; longestH: number }[];
  offers: { id: number; name: string; nights: number | null; darkHoursPerNight: number; hoursOffered: number | null }[];
};

const columns: Column<Darkness["offers"][number]>[] = [
  { key: "configuration", header: "Configuration", rowHeader: true, value: (o) => o.name },
  fixedColumn({ key: "nights", header: "Nights", digits: 0, missing: "not fixed", value: (o) => o.nights }),
  fixedColumn({ key: "dark", header: "Dark hours per night", unit: "h", digits: 2, value: (o) => o.darkHoursPerNight }),
  fixedColumn({ key: "offered", header: "Hours offered", unit: "h", digits: 1, value: (o) => o.hoursOffered }),
];

export function DarknessCard({ darkness }: { darkness: Darkness }) {
  return (
    <Card title="Nights and darkness" className="mt-6">
      {darkness.sites.map((s) => (
        <p key={s.name} className="mb-3 text-sm text-night-700">
          At {s.name}, the {s.periodNights} nights of the period have{" "}
          <span className="num font-medium">{s.meanDarkHoursPerNight.toFixed(2)} h</span> of astronomical darkness on
          average (Sun below −18°; from <span className="num">{s.shortestH.toFixed(2)} h</span> to{" "}
          <span className="num">{s.longestH.toFixed(2)} h</span>), computed night by night by the engine.
        </p>
      ))}
      <DataTable
        columns={columns}
        rows={darkness.offers}
        caption="Hours offered per configuration"
        exportName="hours-offered"
        density="compact"
      />
    </Card>
  );
}
