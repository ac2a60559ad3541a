/** Demand per configuration: hours requested against hours available, and the oversubscription. */
import { Card, type Column, DataTable, fixedColumn } from "~/components/ui";
import type { BoardPageData } from "~/services/committee/board-page.server";

type Demand = BoardPageData["pressure"]["configurations"][number];

const columns: Column<Demand>[] = [
  { key: "configuration", header: "Configuration", rowHeader: true, value: (c) => c.name },
  fixedColumn({ key: "nights", header: "Nights", digits: 0, missing: "not fixed", value: (c) => c.nights }),
  fixedColumn({ key: "available", header: "Available", unit: "h", digits: 1, value: (c) => c.capacityTotalH }),
  fixedColumn({ key: "requested", header: "Requested", unit: "h", digits: 1, value: (c) => c.requestedTotalH }),
  fixedColumn({ key: "unplaceable", header: "Not placeable", unit: "h", digits: 1, value: (c) => c.unplaceableH }),
  fixedColumn({ key: "over", header: "Oversubscription", unit: "×", digits: 2, value: (c) => c.oversubscription }),
  fixedColumn({ key: "suggested", header: "Suggested", unit: "h", digits: 1, value: (c) => c.suggestedTotalH }),
];

export function DemandCard({ pressure }: { pressure: BoardPageData["pressure"] }) {
  return (
    <Card title="Demand and oversubscription">
      <p className="mb-3 text-sm text-night-700">
        Available = nights on offer × mean hours of astronomical darkness per night over the {pressure.periodNights}{" "}
        nights of the period. Oversubscription = requested ÷ available.
      </p>
      <DataTable
        columns={columns}
        rows={pressure.configurations}
        rowKey={(c) => c.configurationId}
        caption="Hours requested and available per configuration"
        exportName="demand-per-configuration"
        density="compact"
      />
      {pressure.unplaceable.length ? (
        <ul className="mt-3 grid gap-1 text-sm text-caution-700">
          {pressure.unplaceable.map((u) => (
            <li key={`${u.proposalId}-${u.target}-${u.configuration}`}>
              {u.target} on {u.configuration}: {u.hours.toFixed(1)} h not placeable — {u.reason}
            </li>
          ))}
        </ul>
      ) : null}
    </Card>
  );
}
