import { and, asc, eq } from "drizzle-orm";
import { useRef, useState } from "react";
import { data, Form, useNavigation } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { TargetFields } from "~/components/targets/TargetForm";
import { Button, ButtonLink, Card, FormErrors, PageHeader, TextArea, TextField } from "~/components/ui";
import { database } from "~/db/client.server";
import { sites } from "~/db/schema/array";
import { type CalibratorJson, proposalTargets, type TimeWindowJson } from "~/db/schema/proposals";
import { formatDeclination, formatRightAscension, parseDeclination, parseRightAscension } from "~/lib/coordinates";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { loadProposalForViewer, proposalIdFrom, proposalNotFound } from "~/services/proposals/access.server";
import { PROPOSAL_LIMITS, ProposalRefusal, saveTarget } from "~/services/proposals/proposals.server";
import { readFormCapped } from "~/services/proposals/upload.server";
import { describeModel } from "~/components/targets/describe-model";
import { readTargetForm, targetFormValues, valuesOfTarget } from "~/services/targets/form.server";
import { bandNames } from "~/services/targets/targets.server";
import type { Route } from "./+types/target";

const L = PROPOSAL_LIMITS;

type WindowRow = { start: string; end: string; note: string };
type CalibratorRow = { name: string; ra: string; dec: string; diameter: string; magnitude: string };
type TargetValues = Record<string, string> & { minElevationDeg?: string };

/** "2027-04-10T03:00" or "2027-04-10 03:00:00Z" (UTC) → ISO "2027-04-10T03:00:00Z"; null if unreadable. */
function readUtc(text: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?(?:\.\d+)?Z?$/i.exec(text.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s = "00"] = m;
  const ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, +s);
  const back = new Date(ms);
  if (back.getUTCMonth() !== +mo - 1 || back.getUTCDate() !== +d || +h > 23 || +mi > 59 || +s > 59) return null;
  if (+y < 2000 || +y > 2200) return null;
  return back.toISOString().replace(/\.\d{3}Z$/, "Z");
}

const toInput = (iso: string) => iso.slice(0, 16);

function rowsOf<T extends Record<string, string>>(form: FormData, fields: Record<keyof T, string>): T[] {
  const columns = Object.entries(fields).map(
    ([key, name]) => [key, form.getAll(name as string).map((x) => (typeof x === "string" ? x : ""))] as const,
  );
  const n = Math.max(0, ...columns.map(([, list]) => list.length));
  const out: T[] = [];
  for (let i = 0; i < n; i++) {
    const row = {} as Record<string, string>;
    for (const [key, list] of columns) row[key] = list[i] ?? "";
    out.push(row as T);
  }
  return out;
}

const isBlank = (row: Record<string, string>) => Object.values(row).every((x) => x.trim() === "");

/** Reads the constraints and calibrators; errors keyed by field ("minElevationDeg", "window-1", "calibrator-0"). */
function readExtras(form: FormData, siteMinElevationDeg: number) {
  const errors: Record<string, string> = {};
  const minText = String(form.get("minElevationDeg") ?? "").trim();
  let minElevationDeg: number | null = null;
  if (minText !== "") {
    const x = Number(minText);
    if (!Number.isFinite(x) || x < 0 || x > 90)
      errors.minElevationDeg = "Minimum elevation: a number of degrees from 0 to 90 (or empty for the array's limit).";
    else if (x < siteMinElevationDeg) {
      errors.minElevationDeg = `Minimum elevation: the array does not observe below ${siteMinElevationDeg}°; leave it empty to use that limit.`;
    } else minElevationDeg = x;
  }
  const windowRows = rowsOf<WindowRow>(form, { start: "windowStart", end: "windowEnd", note: "windowNote" });
  const calibratorRows = rowsOf<CalibratorRow>(form, {
    name: "calName",
    ra: "calRa",
    dec: "calDec",
    diameter: "calDiameter",
    magnitude: "calMagnitude",
  });
  const timeWindows: TimeWindowJson[] = [];
  const kept = windowRows.filter((w) => !isBlank(w));
  if (kept.length > L.windowsMax) errors["window-0"] = `Time windows: at most ${L.windowsMax}.`;
  kept.forEach((w, i) => {
    const label = `Time window ${i + 1}`;
    const start = readUtc(w.start);
    const end = readUtc(w.end);
    if (!start) errors[`window-${i}`] ??= `${label}: the start must be a date and time (UTC), e.g. 2027-04-10 03:00.`;
    else if (!end) errors[`window-${i}`] ??= `${label}: the end must be a date and time (UTC), e.g. 2027-04-10 05:30.`;
    else if (Date.parse(end) <= Date.parse(start))
      errors[`window-${i}`] ??= `${label}: the end must be after the start.`;
    else if (w.note.length > 200) errors[`window-${i}`] ??= `${label}: the note is longer than 200 characters.`;
    else
      timeWindows.push(
        w.note.trim() ? { startUtc: start, endUtc: end, note: w.note.trim() } : { startUtc: start, endUtc: end },
      );
  });
  const calibrators: CalibratorJson[] = [];
  const keptCals = calibratorRows.filter((c) => !isBlank(c));
  if (keptCals.length > L.calibratorsMax) errors["calibrator-0"] = `Calibrators: at most ${L.calibratorsMax}.`;
  keptCals.forEach((c, i) => {
    const label = `Calibrator ${i + 1}`;
    const ra = parseRightAscension(c.ra);
    const dec = parseDeclination(c.dec);
    const diameter = c.diameter.trim() === "" ? undefined : Number(c.diameter);
    const magnitude = c.magnitude.trim() === "" ? undefined : Number(c.magnitude);
    const key = `calibrator-${i}`;
    if (c.name.trim() === "") errors[key] ??= `${label}: a name is required.`;
    else if (c.name.trim().length > 80) errors[key] ??= `${label}: the name is longer than 80 characters.`;
    else if (!ra.ok) errors[key] ??= `${label}: ${ra.message}.`;
    else if (!dec.ok) errors[key] ??= `${label}: ${dec.message}.`;
    else if (diameter !== undefined && !(Number.isFinite(diameter) && diameter > 0 && diameter < 1000))
      errors[key] ??= `${label}: the diameter must be a positive number of mas.`;
    else if (magnitude !== undefined && !(Number.isFinite(magnitude) && magnitude >= -30 && magnitude <= 30))
      errors[key] ??= `${label}: the magnitude must be between -30 and 30.`;
    else {
      const cal: CalibratorJson = { name: c.name.trim(), raDeg: ra.deg, decDeg: dec.deg };
      if (diameter !== undefined) cal.diameterMas = diameter;
      if (magnitude !== undefined) cal.magnitude = magnitude;
      calibrators.push(cal);
    }
  });
  return { errors, minElevationDeg, timeWindows, calibrators, windowRows: kept, calibratorRows: keptCals };
}

function targetIdFrom(param: string | undefined): number | null {
  if (param === "new") return null;
  if (!param || !/^\d{1,9}$/.test(param)) proposalNotFound();
  return Number(param);
}

async function siteMinElevation() {
  const [site] = await database().select().from(sites).orderBy(asc(sites.id)).limit(1);
  return site?.minElevationDeg ?? 0;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const id = proposalIdFrom(params.proposalId);
  const targetId = targetIdFrom(params.targetId);
  const db = database();
  const { proposal, abilities } = await loadProposalForViewer(db, viewer, id);
  const bands = await bandNames(db);
  const base = {
    proposalId: id,
    proposalTitle: proposal.title,
    editable: abilities.canEdit,
    bands,
    siteMinElevationDeg: await siteMinElevation(),
  };
  if (targetId === null) {
    if (!abilities.canEdit) throw data(abilities.lockedBecause ?? "The proposal cannot be changed.", { status: 409 });
    return {
      ...base,
      targetId: null,
      name: "New target",
      model: null as string | null,
      values: { name: "", ra: "", dec: "", model: "point", notes: "", minElevationDeg: "" } as TargetValues,
      windows: [] as WindowRow[],
      calibrators: [] as CalibratorRow[],
    };
  }
  const [t] = await db
    .select()
    .from(proposalTargets)
    .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, id)));
  if (!t) proposalNotFound();
  const values: TargetValues = {
    ...valuesOfTarget(t),
    minElevationDeg: t.minElevationDeg === null ? "" : String(t.minElevationDeg),
  };
  return {
    ...base,
    targetId: t.id,
    name: t.name,
    model: describeModel(t.model),
    values,
    windows: t.timeWindows.map((w) => ({ start: toInput(w.startUtc), end: toInput(w.endUtc), note: w.note ?? "" })),
    calibrators: t.calibrators.map((c) => ({
      name: c.name,
      ra: formatRightAscension(c.raDeg, 2),
      dec: formatDeclination(c.decDeg, 1),
      diameter: c.diameterMas === undefined ? "" : String(c.diameterMas),
      magnitude: c.magnitude === undefined ? "" : String(c.magnitude),
    })),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const id = proposalIdFrom(params.proposalId);
  const targetId = targetIdFrom(params.targetId);
  const db = database();
  await loadProposalForViewer(db, viewer, id);
  const read = await readFormCapped(request);
  if (!read.ok)
    return data(
      {
        values: {} as TargetValues,
        windows: [] as WindowRow[],
        calibrators: [] as CalibratorRow[],
        errors: { form: read.message } as Record<string, string>,
      },
      { status: read.status },
    );
  const form = read.form;
  const bands = await bandNames(db);
  const values: TargetValues = {
    ...targetFormValues(form, bands),
    minElevationDeg: String(form.get("minElevationDeg") ?? ""),
  };
  const core = readTargetForm(values, bands);
  const extras = readExtras(form, await siteMinElevation());
  const errors: Record<string, string> = { ...core.errors, ...extras.errors };
  const keep = { values, windows: extras.windowRows, calibrators: extras.calibratorRows };
  if (!core.target || Object.keys(errors).length > 0) return data({ ...keep, errors }, { status: 400 });
  try {
    await saveTarget(db, viewer, id, targetId, {
      name: core.target.name,
      raDeg: core.target.raDeg,
      decDeg: core.target.decDeg,
      model: core.target.model,
      magnitudes: core.target.magnitudes,
      notes: core.target.notes,
      minElevationDeg: extras.minElevationDeg,
      timeWindows: extras.timeWindows,
      calibrators: extras.calibrators,
    });
  } catch (e) {
    if (e instanceof ProposalRefusal)
      return data({ ...keep, errors: { [e.field ?? "form"]: e.message } }, { status: e.status });
    throw e;
  }
  return redirectWithFlash(`/proposals/${id}`, {
    kind: "success",
    text: `${core.target.name} ${targetId === null ? "added to" : "saved in"} the proposal.`,
  });
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `${d?.name ?? "Target"} — Proposal — Fringe Docket` },
];

export default function ProposalTarget({ loaderData, actionData }: Route.ComponentProps) {
  const d = loaderData;
  const values: TargetValues = actionData?.values ?? d.values;
  const errors: Record<string, string> = actionData?.errors ?? {};
  const counter = useRef(0);
  const keyed = <T,>(rows: T[]) => rows.map((row) => ({ key: ++counter.current, row }));
  const [windows, setWindows] = useState(() => keyed(actionData?.windows ?? d.windows));
  const [calibrators, setCalibrators] = useState(() => keyed(actionData?.calibrators ?? d.calibrators));
  const busy = useNavigation().state === "submitting";
  const back = `/proposals/${d.proposalId}`;
  const readOnly = !d.editable;

  return (
    <>
      <PageHeader
        title={d.targetId === null ? "New target" : d.name}
        lead={<>Target of “{d.proposalTitle || "untitled proposal"}”. Coordinates are J2000; times are UTC.</>}
        actions={
          <ButtonLink to={back} variant="ghost">
            Back to the proposal
          </ButtonLink>
        }
      />
      {readOnly ? (
        <p className="mb-4 rounded-lg bg-info-50 p-3 text-sm text-info-700 ring-1 ring-info-700/20">
          The proposal is read-only; this is how the target stands.
        </p>
      ) : null}
      <Form method="post" noValidate className="grid gap-6" aria-label="Target">
        <FormErrors errors={Object.values(errors)} />
        <fieldset disabled={readOnly} className="grid gap-6">
          <Card title="Target and model">
            <div className="grid gap-4">
              <TargetFields values={values} errors={errors} bands={d.bands} />
            </div>
          </Card>

          <Card title="Constraints">
            <div className="grid gap-4">
              <div className="max-w-xs">
                <TextField
                  label="Minimum elevation"
                  unit="°"
                  name="minElevationDeg"
                  inputMode="decimal"
                  defaultValue={values.minElevationDeg ?? ""}
                  error={errors.minElevationDeg}
                  placeholder={`${d.siteMinElevationDeg} (the array's limit)`}
                  hint={`Empty: the array's own limit, ${d.siteMinElevationDeg}°.`}
                />
              </div>
              <fieldset className="grid gap-3">
                <legend className="mb-1 text-sm font-medium text-night-800">
                  Time-critical windows (UTC): the target must be observed inside one of them
                </legend>
                {windows.length === 0 ? (
                  <p className="text-sm text-night-600">None: any night of the cycle will do.</p>
                ) : null}
                {windows.map(({ key, row }, i) => (
                  <div
                    key={key}
                    className="grid items-end gap-3 rounded-lg bg-night-50 p-3 ring-1 ring-night-200 sm:grid-cols-[1fr_1fr_1.5fr_auto]"
                  >
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
                    <Button
                      variant="ghost"
                      size="sm"
                      onClick={() => setWindows((w) => w.filter((x) => x.key !== key))}
                      aria-label={`Remove window ${i + 1}`}
                    >
                      Remove
                    </Button>
                    {errors[`window-${i}`] ? (
                      <p role="alert" className="text-sm font-medium text-danger-700 sm:col-span-4">
                        {errors[`window-${i}`]}
                      </p>
                    ) : null}
                  </div>
                ))}
                <div>
                  <Button
                    variant="secondary"
                    size="sm"
                    onClick={() => setWindows((w) => [...w, ...keyed([{ start: "", end: "", note: "" }])])}
                    disabled={windows.length >= 20}
                  >
                    Add a time window
                  </Button>
                </div>
              </fieldset>
            </div>
          </Card>

          <Card title="Calibrators">
            <div className="grid gap-3">
              {calibrators.length === 0 ? (
                <p className="text-sm text-night-600">
                  No calibrator yet. Unresolved, nearby stars of similar brightness work best.
                </p>
              ) : null}
              {calibrators.map(({ key, row }, i) => (
                <div
                  key={key}
                  className="grid items-end gap-3 rounded-lg bg-night-50 p-3 ring-1 ring-night-200 sm:grid-cols-[1.3fr_1fr_1fr_0.7fr_0.7fr_auto]"
                >
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
                  <Button
                    variant="ghost"
                    size="sm"
                    onClick={() => setCalibrators((c) => c.filter((x) => x.key !== key))}
                    aria-label={`Remove calibrator ${i + 1}`}
                  >
                    Remove
                  </Button>
                  {errors[`calibrator-${i}`] ? (
                    <p role="alert" className="text-sm font-medium text-danger-700 sm:col-span-6">
                      {errors[`calibrator-${i}`]}
                    </p>
                  ) : null}
                </div>
              ))}
              <div>
                <Button
                  variant="secondary"
                  size="sm"
                  onClick={() =>
                    setCalibrators((c) => [
                      ...c,
                      ...keyed([{ name: "", ra: "", dec: "", diameter: "", magnitude: "" }]),
                    ])
                  }
                  disabled={calibrators.length >= 10}
                >
                  Add a calibrator
                </Button>
              </div>
            </div>
          </Card>

          <Card title="Notes">
            <TextArea
              label="Notes for the committee and the night planners"
              name="notes"
              defaultValue={values.notes}
              error={errors.notes}
              maxLength={1000}
              className="min-h-20"
            />
          </Card>
        </fieldset>
        {readOnly ? null : (
          <div className="flex gap-3">
            <Button type="submit" disabled={busy}>
              {busy ? "Saving…" : d.targetId === null ? "Add the target" : "Save the target"}
            </Button>
            <ButtonLink to={back} variant="ghost">
              Cancel
            </ButtonLink>
          </div>
        )}
      </Form>
      {d.model ? <p className="mt-4 text-sm text-night-600">Stored model: {d.model}.</p> : null}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
