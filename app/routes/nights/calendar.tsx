import { data, Form, href, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Button, Card, PageHeader, SelectField, TextField } from "~/components/ui";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { fieldErrors } from "~/lib/form-errors";
import { requirePermission } from "~/lib/guards.server";
import { invariantResponse, toId } from "~/lib/not-found";
import { cycleCalendar, cycleChoices, defaultCycleId, installRun } from "~/services/nights/calendar.server";
import { RunFormSchema } from "~/services/nights/schemas";
import { NightsCalendar } from "./+shared/NightsCalendar";
import { OffersTable } from "./+shared/OffersTable";
import type { Route } from "./+types/calendar";

export async function loader({ request, context }: Route.LoaderArgs) {
  await requirePermission(request, "nights:build");
  const db = context.get(dbContext);
  const url = new URL(request.url);
  const asked = url.searchParams.get("cycle");
  const cycleId =
    asked === null ? await defaultCycleId(db, { today: new Date().toISOString().slice(0, 10) }) : toId(asked);
  invariantResponse(asked === null || cycleId !== null, "There is no cycle with that number.");
  const choices = await cycleChoices(db);
  const calendar = cycleId === null ? null : await cycleCalendar(db, { cycleId });
  invariantResponse(cycleId === null || calendar, "There is no cycle with that number.");
  return { choices, calendar, today: new Date().toISOString().slice(0, 10) };
}

type RunValues = { cycleId: string; firstNight: string; lastNight: string; configurationId: string };

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "nights:build");
  const form = await requireFormBody(request);
  const str = (k: string) => {
    const x = form.get(k);
    return typeof x === "string" ? x : "";
  };
  const values: RunValues = {
    cycleId: str("cycleId"),
    firstNight: str("firstNight"),
    lastNight: str("lastNight"),
    configurationId: str("configurationId"),
  };
  const parsed = v.safeParse(RunFormSchema, values);
  if (!parsed.success) return data({ values, errors: fieldErrors(parsed.issues, { depth: 1 }) }, { status: 400 });
  const result = await installRun(context.get(dbContext), { input: parsed.output, userId: viewer.user.id });
  if (!result.ok)
    return data({ values, errors: { [result.field ?? "form"]: result.error } }, { status: result.status });
  return redirectWithFlash(`${href("/nights")}?cycle=${parsed.output.cycleId}`, {
    kind: "success",
    text: result.message,
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Night builder — Fringe Docket" }];

/** The two date fields of a run of nights, first and last (both inclusive). */
const RUN_ENDS = [
  ["firstNight", "First night"],
  ["lastNight", "Last night"],
] as const;

function RunForm({
  calendar,
  retry,
}: {
  calendar: NonNullable<Route.ComponentProps["loaderData"]["calendar"]>;
  retry?: { values: RunValues; errors: Record<string, string> };
}) {
  const busy = useNavigation().state === "submitting";
  const v0 = retry?.values;
  const errors = retry?.errors ?? {};
  return (
    <Form
      method="post"
      aria-label="Install a configuration for a run of nights"
      className="grid gap-3 sm:grid-cols-4 sm:items-end"
    >
      <input type="hidden" name="cycleId" value={calendar.cycle.id} />
      {RUN_ENDS.map(([name, label]) => (
        <TextField
          key={name}
          label={label}
          name={name}
          type="date"
          min={calendar.cycle.observingStart}
          max={calendar.cycle.observingEnd}
          defaultValue={v0?.[name] ?? calendar.cycle.observingStart}
          error={errors[name]}
          required
        />
      ))}
      <SelectField
        label="Configuration"
        name="configurationId"
        defaultValue={v0?.configurationId ?? ""}
        error={errors.configurationId}
      >
        <option value="">None (clear these nights)</option>
        {calendar.offers.map((o) => (
          <option key={o.configurationId} value={o.configurationId}>
            {o.name}
          </option>
        ))}
      </SelectField>
      <Button type="submit" disabled={busy}>
        {busy ? "Saving…" : "Install for these nights"}
      </Button>
      {errors.form || errors.cycleId ? <Alert className="sm:col-span-4">{errors.form ?? errors.cycleId}</Alert> : null}
    </Form>
  );
}

export default function NightsCalendarPage({ loaderData, actionData }: Route.ComponentProps) {
  const { calendar, choices } = loaderData;
  return (
    <>
      <PageHeader
        title="Night builder"
        lead="The cycle's nights: which configuration is on the array, how dark each night is, the Moon, and the state of its plan. Open a night to build its plan."
      />
      <Form method="get" className="mb-6 flex flex-wrap items-end gap-2" aria-label="Choose a cycle">
        <SelectField label="Cycle" name="cycle" defaultValue={calendar?.cycle.id ?? ""}>
          {choices.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name} ({c.observingStart} → {c.observingEnd})
            </option>
          ))}
        </SelectField>
        <Button type="submit" variant="secondary">
          Show
        </Button>
      </Form>
      {!calendar ? (
        <Alert tone="info">No cycle exists yet: the chair opens one with its observing period.</Alert>
      ) : (
        <div className="grid grid-cols-1 gap-6">
          <Card title={`Configurations of ${calendar.cycle.name}: nights offered and installed`}>
            <OffersTable offers={calendar.offers} />
          </Card>
          <Card title="Install a configuration for a run of nights">
            <p className="mb-3 text-sm text-night-600">
              Every night from the first to the last (both included) gets the configuration; choose none to clear them.
              A night whose plan was made for another configuration keeps it until its draft is discarded.
            </p>
            <RunForm calendar={calendar} retry={actionData} key={JSON.stringify(actionData?.values ?? null)} />
          </Card>
          <NightsCalendar calendar={calendar} today={loaderData.today} />
        </div>
      )}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
