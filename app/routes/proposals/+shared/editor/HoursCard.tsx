/** The hours requested per configuration the cycle offers: a form while editable, else the hours as text. */
import { Form } from "react-router";
import { Button, Card, DetailList, TextField } from "~/components/ui";
import type { ActionResult } from "./result";

export type HoursCardProps = {
  configurations: { id: number; name: string; stations: string[]; hours: number | null }[];
  hoursMax: number;
  editable: boolean;
  result?: ActionResult;
};

const stationsText = (stations: string[]) => `${stations.length} stations: ${stations.join(", ")}`;

/** The hours of each configuration as read-only text ("none" where none are requested). */
function HoursText({ configurations }: Pick<HoursCardProps, "configurations">) {
  return (
    <DetailList
      className="grid gap-3 sm:grid-cols-3"
      valueClassName="text-night-900"
      items={configurations.map((c) => ({
        label: c.name,
        value: (
          <>
            <span className="num font-medium">{c.hours === null ? "none" : `${c.hours} h`}</span>
            <span className="block text-sm text-night-600">{stationsText(c.stations)}</span>
          </>
        ),
      }))}
    />
  );
}

export function HoursCard({ configurations, hoursMax, editable, result }: HoursCardProps) {
  const total = configurations.reduce((a, c) => a + (c.hours ?? 0), 0);
  return (
    <Card
      title="Requested hours"
      actions={<span className="num text-sm text-night-600">{total.toFixed(1)} h in all</span>}
    >
      {configurations.length === 0 ? (
        <p className="text-sm text-night-600">This cycle offers no configuration yet.</p>
      ) : null}
      {editable ? (
        <Form method="post" className="grid gap-3" noValidate aria-label="Requested hours">
          <input type="hidden" name="intent" value="hours" />
          <div className="grid gap-3 sm:grid-cols-3">
            {configurations.map((c) => {
              const key = `hours-${c.id}`;
              return (
                <div key={c.id}>
                  <input type="hidden" name={`label-${c.id}`} value={c.name} />
                  <TextField
                    label={c.name}
                    unit="h"
                    name={key}
                    inputMode="decimal"
                    defaultValue={result?.values?.[key] ?? (c.hours === null ? "" : String(c.hours))}
                    error={result?.errors[key]}
                    hint={stationsText(c.stations)}
                    placeholder="none"
                  />
                </div>
              );
            })}
          </div>
          {configurations.length > 0 ? (
            <div>
              <Button type="submit" variant="secondary">
                Save hours
              </Button>
              <span className="ml-3 text-sm text-night-600">
                Leave a configuration empty to request none; at most {hoursMax} h each.
              </span>
            </div>
          ) : null}
        </Form>
      ) : (
        <HoursText configurations={configurations} />
      )}
    </Card>
  );
}
