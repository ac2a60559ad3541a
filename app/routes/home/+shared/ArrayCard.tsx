import { href, Link } from "react-router";
import { Card } from "~/components/ui";
import type { ArraySummary } from "~/services/home/summary.server";

/** "Label: a (note), b (note)." with each name stressed. */
function NamedList({
  label,
  separator,
  items,
}: {
  label: string;
  separator: string;
  items: { name: string; note: string }[];
}) {
  return (
    <p>
      {label}:{" "}
      {items.map((item, i) => (
        <span key={item.name}>
          {i > 0 ? separator : ""}
          <span className="font-medium text-night-900">{item.name}</span> ({item.note})
        </span>
      ))}
      .
    </p>
  );
}

/** The registered array in a few lines: where it stands, its configurations and instruments. */
export function ArrayCard({ array }: { array: ArraySummary | null }) {
  return (
    <Card title="The array">
      {array ? (
        <div className="space-y-3 text-night-700">
          <p>
            <span className="font-semibold text-night-900">{array.name}</span> — latitude{" "}
            <span className="num">{array.latitudeDeg.toFixed(2)}°</span>, longitude{" "}
            <span className="num">{array.longitudeDeg.toFixed(2)}°</span>, altitude{" "}
            <span className="num">{array.altitudeM.toFixed(0)} m</span>; <span className="num">{array.stations}</span>{" "}
            stations.
          </p>
          <NamedList
            label="Configurations"
            separator=", "
            items={array.configurations.map((c) => ({ name: c.name, note: `${c.size} stations` }))}
          />
          <NamedList
            label="Instruments"
            separator="; "
            items={array.instruments.map((i) => ({
              name: i.name,
              note: `${i.bands.join(", ")} band${i.bands.length > 1 ? "s" : ""}`,
            }))}
          />
          <Link
            to={href("/registry")}
            className="inline-block font-medium text-ember-700 underline underline-offset-2 hover:text-ember-800"
          >
            Open the array registry
          </Link>
        </div>
      ) : (
        <p className="text-night-700">No array is registered yet. An administrator adds the site and its stations.</p>
      )}
    </Card>
  );
}
