/** The calibrators of a target: name, coordinates and, when known, diameter and magnitude. */
import { Card, TextField } from "~/components/ui";
import type { CalibratorRow } from "~/services/proposals/target-form.server";
import { RepeatedRows } from "./RepeatedRows";

export type CalibratorsCardProps = {
  calibrators: CalibratorRow[];
  calibratorsMax: number;
  errors: Record<string, string>;
};

export function CalibratorsCard({ calibrators, calibratorsMax, errors }: CalibratorsCardProps) {
  return (
    <Card title="Calibrators">
      <div className="grid gap-3">
        <RepeatedRows
          initial={calibrators}
          empty={{ name: "", ra: "", dec: "", diameter: "", magnitude: "" }}
          max={calibratorsMax}
          what="calibrator"
          addLabel="Add a calibrator"
          none={
            <p className="text-sm text-night-600">
              No calibrator yet. Unresolved, nearby stars of similar brightness work best.
            </p>
          }
          layout="sm:grid-cols-[1.3fr_1fr_1fr_0.7fr_0.7fr_auto]"
          errorSpan="sm:col-span-6"
          errorOf={(i) => errors[`calibrator-${i}`]}
          fields={(row, i) => (
            <>
              <TextField label={`Calibrator ${i + 1} name`} name="calName" defaultValue={row.name} maxLength={80} />
              <TextField label="RA" name="calRa" defaultValue={row.ra} placeholder="hh:mm:ss" />
              <TextField label="Dec" name="calDec" defaultValue={row.dec} placeholder="±dd:mm:ss" />
              <TextField
                label="Diameter"
                unit="mas"
                name="calDiameter"
                inputMode="decimal"
                defaultValue={row.diameter}
                placeholder="optional"
              />
              <TextField
                label="Magnitude"
                name="calMagnitude"
                inputMode="decimal"
                defaultValue={row.magnitude}
                placeholder="optional"
              />
            </>
          )}
        />
      </div>
    </Card>
  );
}
