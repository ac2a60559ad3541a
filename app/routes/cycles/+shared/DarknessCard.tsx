/** Nights per configuration and the hours of darkness they give over the cycle (engine: Sun below −18°). */
import { Card } from "~/components/ui";

type Darkness = {
  sites: { name: string; periodNights: number; meanDarkHoursPerNight: number; shortestH: number; longestH: number }[];
  offers: { id: number; name: string; nights: number | null; darkHoursPerNight: number; hoursOffered: number | null }[];
};

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
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Hours offered per configuration</caption>
          <thead>
            <tr className="text-left text-night-700">
              <th scope="col" className="py-1 pr-4 font-semibold">
                Configuration
              </th>
              <th scope="col" className="py-1 pr-4 text-right font-semibold">
                Nights
              </th>
              <th scope="col" className="py-1 pr-4 text-right font-semibold">
                Dark hours per night (h)
              </th>
              <th scope="col" className="py-1 text-right font-semibold">
                Hours offered (h)
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-night-100">
            {darkness.offers.map((o) => (
              <tr key={o.id}>
                <th scope="row" className="py-1 pr-4 text-left font-medium">
                  {o.name}
                </th>
                <td className="num py-1 pr-4 text-right">{o.nights ?? "not fixed"}</td>
                <td className="num py-1 pr-4 text-right">{o.darkHoursPerNight.toFixed(2)}</td>
                <td className="num py-1 text-right">{o.hoursOffered === null ? "—" : o.hoursOffered.toFixed(1)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Card>
  );
}
