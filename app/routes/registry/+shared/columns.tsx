/** Table columns the registry's pages share: a station link, fixed-decimal figures, a band's wavelengths and limits. */
import { Link } from "react-router";
import type { Column } from "~/components/ui";
import { stationHref } from "./links";
import { linkClass } from "./RegistryBits";

/** A station's name, linking to its page. */
export function stationColumn<Row extends { id: number; name: string }>(key: string, header: string): Column<Row> {
  return {
    key,
    header,
    value: (s) => s.name,
    render: (s) => (
      <Link to={stationHref(s.id)} className={linkClass}>
        {s.name}
      </Link>
    ),
  };
}

/**
 * A right-aligned figure shown with `digits` decimals; sorted and exported as it is, or rounded to
 * the same decimals when `rounded`.
 */
export function fixedColumn<Row>(
  key: string,
  header: string,
  unit: string,
  pick: (row: Row) => number,
  digits: number,
  rounded = false,
): Column<Row> {
  const round = (x: number) => Math.round(x * 10 ** digits) / 10 ** digits;
  return {
    key,
    header,
    unit,
    align: "right",
    value: (row) => (rounded ? round(pick(row)) : pick(row)),
    render: (row) => pick(row).toFixed(digits),
  };
}

type BandFigures = { centralWavelengthM: number; bandwidthM: number; channels: number; limitingMagnitude: number };

/** A band's central wavelength and bandwidth (µm, as `microns` writes metres), channels and limiting magnitude. */
export function bandColumns<Row extends BandFigures>(microns: (m: number) => number): Column<Row>[] {
  return [
    {
      key: "wavelength",
      header: "Central wavelength",
      unit: "µm",
      align: "right",
      value: (b) => microns(b.centralWavelengthM),
    },
    { key: "bandwidth", header: "Bandwidth", unit: "µm", align: "right", value: (b) => microns(b.bandwidthM) },
    { key: "channels", header: "Channels", align: "right", value: (b) => b.channels },
    { key: "limit", header: "Limiting magnitude", unit: "mag", align: "right", value: (b) => b.limitingMagnitude },
  ];
}
