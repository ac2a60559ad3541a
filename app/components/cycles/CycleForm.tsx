import { Form, useNavigation } from "react-router";
import { Button, Card, FormErrors, TextArea, TextField } from "~/components/ui";
import type { CycleFormValues } from "~/services/cycles/form";

export type ConfigurationChoice = { id: number; name: string; description: string; stations: number };

/** The chair's form for a cycle: dates, deadline and the configurations on offer with their nights. */
export function CycleForm({
  values,
  errors,
  configurations,
  submitLabel,
}: {
  values: CycleFormValues;
  errors: Record<string, string>;
  configurations: ConfigurationChoice[];
  submitLabel: string;
}) {
  const busy = useNavigation().state === "submitting";
  const summary = Object.values(errors);
  return (
    <Form method="post" className="grid gap-6" noValidate>
      <FormErrors errors={summary} />
      <Card title="The cycle">
        <div className="grid gap-4 md:grid-cols-2">
          <TextField
            label="Name"
            name="name"
            defaultValue={values.name}
            error={errors.name}
            maxLength={40}
            required
            placeholder="2027B"
          />
          <TextField
            label="Submission deadline"
            unit="UTC"
            name="submissionDeadline"
            type="datetime-local"
            defaultValue={values.submissionDeadline}
            error={errors.submissionDeadline}
            required
          />
          <TextField
            label="First night"
            name="observingStart"
            type="date"
            defaultValue={values.observingStart}
            error={errors.observingStart}
            required
            hint="The night that begins on the evening of this date."
          />
          <TextField
            label="Last night"
            name="observingEnd"
            type="date"
            defaultValue={values.observingEnd}
            error={errors.observingEnd}
            required
          />
          <div className="md:col-span-2">
            <TextArea
              label="Description"
              name="description"
              defaultValue={values.description}
              error={errors.description}
              maxLength={500}
            />
          </div>
        </div>
      </Card>
      <Card title="Configurations on offer">
        {errors.offered ? (
          <p role="alert" className="mb-2 text-sm font-medium text-danger-700">
            {errors.offered}
          </p>
        ) : null}
        <ul className="divide-y divide-night-100">
          {configurations.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center gap-4 py-3">
              <label className="flex min-w-56 flex-1 items-start gap-2">
                <input
                  type="checkbox"
                  name="offered"
                  value={c.id}
                  defaultChecked={values.offered.includes(String(c.id))}
                  className="mt-1 h-4 w-4 accent-ember-700"
                />
                <span>
                  <span className="font-medium">{c.name}</span>{" "}
                  <span className="text-sm text-night-600">({c.stations} stations)</span>
                  <span className="block text-sm text-night-600">{c.description}</span>
                </span>
              </label>
              <div className="w-44">
                <TextField
                  label={`Nights for ${c.name}`}
                  name={`nights-${c.id}`}
                  inputMode="decimal"
                  defaultValue={values.nights[c.id] ?? ""}
                  error={errors[`nights-${c.id}`]}
                  unit="nights"
                />
              </div>
            </li>
          ))}
        </ul>
      </Card>
      <div>
        <Button type="submit" disabled={busy}>
          {busy ? "Saving…" : submitLabel}
        </Button>
      </div>
    </Form>
  );
}
