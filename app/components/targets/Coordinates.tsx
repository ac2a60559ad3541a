/**
 * A target's J2000 position as every page writes it: sexagesimal (RA in hours, Dec in degrees), the
 * decimal degrees in the tooltip.
 */
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";

export function Coordinates({ raDeg, decDeg }: { raDeg: number; decDeg: number }) {
  const sign = decDeg >= 0 ? "+" : "";
  return (
    <span className="num" title={`RA ${raDeg.toFixed(4)}°, Dec ${sign}${decDeg.toFixed(4)}° (J2000)`}>
      RA {formatRightAscension(raDeg, 2)}, Dec {formatDeclination(decDeg, 1)}
    </span>
  );
}
