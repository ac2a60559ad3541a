/**
 * The shortlist's settings as a GET form (the address carries them, so a shortlist can be shared):
 * the target (a star's name, or coordinates) unless the page fixes it, band, configuration or baseline,
 * night, and the rules. Each field shows what was typed and its own message.
 */
import type { ReactNode } from "react";
import { Form, useNavigation } from "react-router";
import { StarNameField } from "~/components/catalogue/StarNameField";
import { Button, Card, FormErrors, SelectField, TextField } from "~/components/ui";
import type { ShortlistValues } from "~/services/catalogue/schemas";
import type { ShortlistChoices } from "~/services/catalogue/shortlist.server";

type Props = {
  values: ShortlistValues;
  errors: Record<string, string>;
  choices: ShortlistChoices;
  /** False when the page's target is fixed (a proposal's target). */
  withTarget: boolean;
  /** Shown in place of the target fields when the target is fixed. */
  fixedTarget?: ReactNode;
};

export function SettingsForm({ values, errors, choices, withTarget, fixedTarget }: Props) {
  // A GET form: the page is "loading" (not "submitting") while the next shortlist is computed.
  const busy = useNavigation().state !== "idle";
  const field = (name: keyof ShortlistValues) => ({ name, defaultValue: values[name], error: errors[name] });
  const band = choices.bands.find((b) => String(b.id) === values.band);
  return (
    <Card title="Settings">
      <Form method="get" className="grid gap-4" noValidate aria-label="Shortlist settings">
        <FormErrors errors={Object.values(errors)} />
        {withTarget ? (
          <div className="grid gap-4 md:grid-cols-3">
            <StarNameField
              label="Target"
              {...field("target")}
              fill={{ ra: "ra", dec: "dec" }}
              maxLength={100}
              placeholder="Betelgeuse, α Ori, HD 39801…"
              hint="A star's name or designation; or leave it and type coordinates."
            />
            <TextField
              label="Right ascension"
              {...field("ra")}
              placeholder="05:55:10.3 or 88.79"
              hint="J2000; optional when the name is a catalogue star"
              autoComplete="off"
            />
            <TextField label="Declination" {...field("dec")} placeholder="+07:24:25 or 7.41" autoComplete="off" />
          </div>
        ) : (
          fixedTarget
        )}
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <SelectField label="Band" {...field("band")}>
            {choices.bands.map((b) => (
              <option key={b.id} value={b.id}>
                {b.label}
              </option>
            ))}
          </SelectField>
          <SelectField label="Configuration" {...field("config")}>
            {choices.configurations.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name} ({c.stations} stations, longest baseline {c.longestBaselineM.toFixed(0)} m)
              </option>
            ))}
            <option value="">— the baseline typed beside —</option>
          </SelectField>
          <TextField
            label="Longest baseline"
            unit="m"
            inputMode="decimal"
            {...field("baseline")}
            hint="Used when no configuration is picked"
          />
          <TextField label="Night of" type="date" {...field("date")} hint="The night begins on this evening" />
        </div>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <TextField label="Elevation limit" unit="°" inputMode="decimal" {...field("minElevation")} />
          <TextField label="Within" unit="° of the target" inputMode="decimal" {...field("maxDistance")} />
          <TextField label="Smallest V²" inputMode="decimal" {...field("minVis2")} hint="0.8: nearly unresolved" />
          <TextField label="Entries" inputMode="numeric" {...field("limit")} />
          <TextField
            label="Magnitude range"
            unit="mag"
            inputMode="decimal"
            {...field("maxMagDiff")}
            hint="Largest difference from the target's; empty for any"
          />
          <TextField
            label="Band limit"
            unit="mag"
            inputMode="decimal"
            {...field("bandLimit")}
            hint={band?.limitingMagnitude != null ? `Empty: the band's, ${band.limitingMagnitude} mag` : "Empty: none"}
          />
          <TextField
            label="Target's band magnitude"
            unit="mag"
            inputMode="decimal"
            {...field("targetMag")}
            hint={withTarget ? "Empty: estimated for a catalogue star" : "Empty: the target's own, else unknown"}
          />
        </div>
        <div>
          <Button type="submit" disabled={busy}>
            {busy ? "Finding calibrators…" : "Show the shortlist"}
          </Button>
        </div>
      </Form>
    </Card>
  );
}
