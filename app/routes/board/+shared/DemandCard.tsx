/** Demand per configuration: hours requested against hours available, and the oversubscription. */
import { Card } from "~/components/ui";
import type { BoardPageData } from "~/services/committee/board-page.server";

export function DemandCard({ pressure }: { pressure: BoardPageData["pressure"] }) {
  return (
    <Card title="Demand and oversubscription">
      <p className="mb-3 text-sm text-night-700">
        Available = nights on offer × mean hours of astronomical darkness per night over the {pressure.periodNights}{" "}
        nights of the period. Oversubscription = requested ÷ available.
      </p>
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Hours requested and available per configuration</caption>
          <thead>
            <tr className="text-left text-night-700">
              <th scope="col" className="py-1 pr-3 font-semibold">
                Configuration
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Nights
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Available (h)
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Requested (h)
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Not placeable (h)
              </th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">
                Oversubscription (×)
              </th>
              <th scope="col" className="py-1 text-right font-semibold">
                Suggested (h)
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-night-100">
            {pressure.configurations.map((c) => (
              <tr key={c.configurationId}>
                <th scope="row" className="py-1 pr-3 text-left font-medium">
                  {c.name}
                </th>
                <td className="num py-1 pr-3 text-right">{c.nights ?? "not fixed"}</td>
                <td className="num py-1 pr-3 text-right">{c.capacityTotalH.toFixed(1)}</td>
                <td className="num py-1 pr-3 text-right">{c.requestedTotalH.toFixed(1)}</td>
                <td className="num py-1 pr-3 text-right">{c.unplaceableH.toFixed(1)}</td>
                <td className="num py-1 pr-3 text-right">
                  {c.oversubscription === null ? "—" : c.oversubscription.toFixed(2)}
                </td>
                <td className="num py-1 text-right">{c.suggestedTotalH.toFixed(1)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
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
