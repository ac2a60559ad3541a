/**
 * The Sketchpad's top three calibrators for the target on screen: the catalogue stars near it that stay
 * nearly unresolved on the sketch's longest baseline and are up with it that night, with a link to the
 * full Calibrator shortlist of the same target and baseline.
 */
import { CalibratorPeek, calibratorShortlistHref } from "~/components/catalogue/CalibratorPeek";
import { Card } from "~/components/ui";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import type { CoverageBody } from "~/services/sketch/request";

/** The longest station-to-station distance of the sketch, metres (the longest baseline it can project). */
export function longestBaselineM(stations: CoverageBody["stations"]): number {
  let longest = 0;
  for (let i = 0; i < stations.length; i++) {
    for (let j = i + 1; j < stations.length; j++) {
      const a = stations[i];
      const b = stations[j];
      longest = Math.max(longest, Math.hypot(a.eastM - b.eastM, a.northM - b.northM, a.upM - b.upM));
    }
  }
  return longest;
}

/** The central channel's wavelength, metres. */
const centralWavelength = (wavelengthsM: number[]) => wavelengthsM[Math.floor(wavelengthsM.length / 2)];

export function SketchCalibrators({ body, date }: { body: CoverageBody; date: string }) {
  const baselineM = longestBaselineM(body.stations);
  if (baselineM === 0) return null;
  const night = body.night?.date ?? date;
  return (
    <Card>
      <CalibratorPeek
        target={{ raDeg: body.target.raDeg, decDeg: body.target.decDeg }}
        wavelengthM={centralWavelength(body.wavelengthsM)}
        longestBaselineM={baselineM}
        site={body.site}
        date={night}
        minElevationDeg={body.minElevationDeg}
        moreHref={calibratorShortlistHref({
          target: body.target.name || undefined,
          ra: formatRightAscension(body.target.raDeg, 2),
          dec: formatDeclination(body.target.decDeg, 1),
          baselineM: Math.round(baselineM * 10) / 10,
          date: night,
        })}
      />
    </Card>
  );
}
