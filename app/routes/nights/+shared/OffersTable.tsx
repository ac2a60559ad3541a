import { SERIES_COLOURS } from "~/components/plots/Plot";
import { type Column, DataTable } from "~/components/ui";

export type Offer = { configurationId: number; name: string; nightsOffered: number | null; nightsInstalled: number };

/** The colour a configuration wears in the calendar, by its place in the cycle's offer. */
export function configurationColour(index: number): string {
  return SERIES_COLOURS[index % SERIES_COLOURS.length];
}

const columns: Column<Offer & { colour: string }>[] = [
  {
    key: "name",
    header: "Configuration",
    value: (o) => o.name,
    render: (o) => (
      <span className="inline-flex items-center gap-2 font-medium">
        <span aria-hidden="true" className="inline-block h-3 w-3 rounded-sm" style={{ backgroundColor: o.colour }} />
        {o.name}
      </span>
    ),
  },
  { key: "offered", header: "Nights offered", unit: "nights", align: "right", value: (o) => o.nightsOffered },
  { key: "installed", header: "Nights installed", unit: "nights", align: "right", value: (o) => o.nightsInstalled },
  {
    key: "difference",
    header: "Installed − offered",
    unit: "nights",
    align: "right",
    value: (o) => (o.nightsOffered === null ? null : o.nightsInstalled - o.nightsOffered),
  },
];

/** Nights the chair offered per configuration against the nights the scheduler installed. */
export function OffersTable({ offers }: { offers: Offer[] }) {
  const rows = offers.map((o, i) => ({ ...o, colour: configurationColour(i) }));
  return (
    <DataTable
      columns={columns}
      rows={rows}
      rowKey={(o) => o.configurationId}
      caption="Nights offered and installed per configuration"
      exportName="nights-per-configuration"
      empty="The cycle offers no configuration."
    />
  );
}
