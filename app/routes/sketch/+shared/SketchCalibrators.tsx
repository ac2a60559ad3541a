/**
 * The Sketchpad's top three calibrators for the target on screen: the catalogue stars near it that stay
 * nearly unresolved on the sketch's longest baseline and are up with it that night, with a link to the
 * full Calibrator shortlist of the same target and baseline.
 */
import { CalibratorPeek, calibratorShortlistHref } from "~/components/catalogue/CalibratorPeek";
import { Card } from "~/components/ui";
import { longestBaselineM } from "~/engine";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import type { CoverageBody } from "~/services/sketch/request";

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
