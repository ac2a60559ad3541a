/** A target's constraints: its own elevation limit and the time-critical windows it must be observed in. */
import { Card, TextField } from "~/components/ui";
import type { WindowRow } from "~/services/proposals/target-form.server";
import { bind } from "../bind";
import { RepeatedRows } from "./RepeatedRows";

export type ConstraintsCardProps = {
  minElevationDeg: string;
  siteMinElevationDeg: number;
  windows: WindowRow[];
  windowsMax: number;
  errors: Record<string, string>;
};

export function ConstraintsCard({
  minElevationDeg,
  siteMinElevationDeg,
  windows,
  windowsMax,
  errors,
}: ConstraintsCardProps) {
  return (
    <Card title="Constraints">
      <div className="grid gap-4">
        <div className="max-w-xs">
          <TextField
            label="Minimum elevation"
            unit="°"
            inputMode="decimal"
            {...bind("minElevationDeg", { minElevationDeg }, errors)}
            placeholder={`${siteMinElevationDeg} (the array's limit)`}
            hint={`Empty: the array's own limit, ${siteMinElevationDeg}°.`}
          />
        </div>
        <fieldset className="grid gap-3">
          <legend className="mb-1 text-sm font-medium text-night-800">
            Time-critical windows (UTC): the target must be observed inside one of them
          </legend>
          <RepeatedRows
            initial={windows}
            empty={{ start: "", end: "", note: "" }}
            max={windowsMax}
            what="window"
            addLabel="Add a time window"
            none={<p className="text-sm text-night-600">None: any night of the cycle will do.</p>}
            layout="sm:grid-cols-[1fr_1fr_1.5fr_auto]"
            errorSpan="sm:col-span-4"
            errorOf={(i) => errors[`window-${i}`]}
            fields={(row, i) => (
              <>
                <TextField
                  label={`Window ${i + 1} start`}
                  unit="UTC"
                  type="datetime-local"
                  name="windowStart"
                  defaultValue={row.start}
                />
                <TextField label="End" unit="UTC" type="datetime-local" name="windowEnd" defaultValue={row.end} />
                <TextField
                  label="Note"
                  name="windowNote"
                  defaultValue={row.note}
                  maxLength={200}
                  placeholder="e.g. eclipse ingress"
                />
              </>
            )}
          />
        </fieldset>
      </div>
    </Card>
  );
}
