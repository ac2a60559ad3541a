import { href, Link } from "react-router";
import type { Column } from "~/components/ui";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";

type Sexagesimal = { ra: string; dec: string };

/** A target's coordinates as both target tables show them: RA "hh:mm:ss.ss", Dec "±dd:mm:ss.s". */
export function coordinateText(t: { raDeg: number; decDeg: number }): Sexagesimal {
  return { ra: formatRightAscension(t.raDeg, 2), dec: formatDeclination(t.decDeg, 1) };
}

const AXES = [
  { key: "ra", header: "RA", unit: "h:m:s" },
  { key: "dec", header: "Dec", unit: "°:′:″" },
] as const;

/**
 * The RA and Dec columns of a target table. With `degrees`, the headers name the `epoch` and the
 * columns sort by angle; without, they sort by their text.
 */
export function coordinateColumns<Row extends Sexagesimal>(degrees?: {
  epoch: string;
  of: (row: Row) => { ra: number; dec: number };
}): Column<Row>[] {
  return AXES.map(({ key, header, unit }) => ({
    key,
    header: degrees ? `${header} (${degrees.epoch})` : header,
    unit,
    value: (row: Row) => (degrees ? degrees.of(row)[key] : row[key]),
    render: degrees ? (row: Row) => <span className="num">{row[key]}</span> : undefined,
  }));
}

/** A target's name, linking to its page. */
export function TargetLink({ id, name }: { id: number; name: string }) {
  return (
    <Link
      className="font-medium text-ember-700 underline-offset-2 hover:underline"
      to={href("/targets/:targetId", { targetId: String(id) })}
    >
      {name}
    </Link>
  );
}
