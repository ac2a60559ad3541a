import { useFetcher } from "react-router";
import { Alert, Button, Card, TextField } from "~/components/ui";
import type { NightPlanSettingsJson } from "~/db/schema/nights";
import { FetcherResult } from "./FetcherResult";
import type { NightActionData } from "./intents.server";

const FIELDS: { name: keyof NightPlanSettingsJson; label: string; unit: string; step: string; hint?: string }[] = [
  {
    name: "minElevationDeg",
    label: "Elevation limit",
    unit: "°",
    step: "0.1",
    hint: "For targets without their own limit.",
  },
  {
    name: "moonMinSeparationDeg",
    label: "Moon distance",
    unit: "°",
    step: "0.1",
    hint: "0 switches the Moon check off.",
  },
  {
    name: "sunMinSeparationDeg",
    label: "Sun avoidance angle",
    unit: "°",
    step: "0.1",
    hint: "Nothing closer to the Sun is ever planned; set the observatory's own angle.",
  },
  { name: "scienceBlockMin", label: "Science block", unit: "min", step: "1" },
  { name: "calibratorBlockMin", label: "Calibrator block", unit: "min", step: "1" },
];

/** The planner's limits and block lengths for this night, and the safety caution. */
export function SettingsCard({
  settings,
  editable,
  caution,
}: {
  settings: NightPlanSettingsJson;
  editable: boolean;
  caution: string;
}) {
  const fetcher = useFetcher<NightActionData>();
  const errors = fetcher.data?.intent === "settings" ? fetcher.data.errors : {};
  return (
    <Card title="Limits and block lengths">
      <Alert tone="caution" className="mb-4">
        <strong>Safety.</strong> {caution} A target within the Sun avoidance angle cannot be planned; wind and humidity
        limits are the observatory's to apply at the telescope.
      </Alert>
      <fetcher.Form method="post" aria-label="Plan settings" className="grid gap-3 sm:grid-cols-3 lg:grid-cols-5">
        <input type="hidden" name="intent" value="settings" />
        {FIELDS.map((f) => (
          <TextField
            key={f.name}
            label={f.label}
            unit={f.unit}
            name={f.name}
            type="number"
            inputMode="decimal"
            step={f.step}
            defaultValue={String(settings[f.name])}
            hint={f.hint}
            error={errors[f.name]}
            disabled={!editable}
            required
          />
        ))}
        <div className="flex flex-wrap items-center gap-3 sm:col-span-3 lg:col-span-5">
          <Button type="submit" variant="secondary" disabled={!editable || fetcher.state !== "idle"}>
            {fetcher.state !== "idle" ? "Saving…" : "Save settings"}
          </Button>
          {!editable ? <span className="text-sm text-night-600">A published plan keeps its settings.</span> : null}
          {fetcher.data?.intent === "settings" ? <FetcherResult data={fetcher.data} /> : null}
        </div>
      </fetcher.Form>
    </Card>
  );
}
