import { eq } from "drizzle-orm";
import { type FormEvent, useEffect, useRef, useState } from "react";
import { data, Form, Link, type ShouldRevalidateFunctionArgs, useFetcher, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import {
  Badge,
  Button,
  ButtonLink,
  Card,
  cx,
  FormErrors,
  PageHeader,
  SelectField,
  TextArea,
  TextField,
} from "~/components/ui";
import { database } from "~/db/client.server";
import { SCIENCE_CATEGORIES } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import { loadProposalForViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { formatBytes, MAX_PDF_BYTES } from "~/services/proposals/pdf";
import {
  addCoInvestigator,
  addTargetFromMine,
  deadlineCountdown,
  formatUtc,
  loadProposalDetails,
  missingForSubmission,
  moveTarget,
  PROPOSAL_LIMITS,
  ProposalRefusal,
  removeCoInvestigator,
  removeScienceCase,
  removeTarget,
  reopenProposal,
  STATUS_WORDS,
  saveDetails,
  saveHours,
  submitProposal,
  uploadScienceCase,
  withdrawProposal,
} from "~/services/proposals/proposals.server";
import { isMultipart, readFormCapped, readMultipartCapped } from "~/services/proposals/upload.server";
import { describeModel } from "~/components/targets/describe-model";
import type { Route } from "./+types/editor";
import { countWords, describeMagnitudes, fmtUtc, StatusBadge, type StatusKey } from "./parts";

// ---------------------------------------------------------------- schemas

const L = PROPOSAL_LIMITS;

const DetailsSchema = v.object({
  title: v.pipe(
    v.string(),
    v.trim(),
    v.nonEmpty("Title: must not be empty."),
    v.regex(/^[^\r\n\t]*$/, "Title: must be a single line."),
    v.maxLength(L.titleMaxChars, `Title: at most ${L.titleMaxChars} characters.`),
  ),
  abstract: v.pipe(
    v.string(),
    v.trim(),
    v.maxLength(L.abstractMaxChars, `Abstract: at most ${L.abstractMaxChars} characters.`),
    v.check((s) => countWords(s) <= L.abstractMaxWords, `Abstract: at most ${L.abstractMaxWords} words.`),
  ),
  scienceCategory: v.union(
    [v.literal(""), v.picklist(SCIENCE_CATEGORIES)],
    "Science category: choose one of the categories listed.",
  ),
  bandId: v.pipe(
    v.string(),
    v.regex(/^(\d{1,9})?$/, "Instrument and band: choose one of the bands listed."),
    v.transform((s) => (s === "" ? null : Number(s))),
  ),
});

const EmailSchema = v.pipe(
  v.string(),
  v.trim(),
  v.nonEmpty("Co-investigator e-mail: write an address."),
  v.maxLength(320, "Co-investigator e-mail: too long."),
  v.email("Co-investigator e-mail: not an e-mail address."),
);

const IdSchema = v.pipe(v.string(), v.regex(/^\d{1,9}$/, "Unknown item."), v.transform(Number));

const HoursSchema = v.pipe(
  v.string(),
  v.trim(),
  v.transform((s) => (s === "" ? null : Number(s))),
  v.nullable(
    v.pipe(
      v.number("must be a number of hours"),
      v.finite("must be a number of hours"),
      v.gtValue(0, "must be more than 0 h (leave it empty to request none)"),
      v.maxValue(L.hoursMax, `must be at most ${L.hoursMax} h`),
    ),
  ),
);

type Values = Record<string, string>;
type ActionResult = { intent: string; values?: Values; errors: Record<string, string>; savedAt?: string };

const fail = (intent: string, errors: Record<string, string>, status: number, values?: Values) =>
  data<ActionResult>({ intent, errors, values }, { status });

function firstErrors(issues: v.BaseIssue<unknown>[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = String(issue.path?.[0]?.key ?? "form");
    out[key] ??= issue.message;
  }
  return out;
}

// ---------------------------------------------------------------- loader

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const id = proposalIdFrom(params.proposalId);
  const db = database();
  const now = new Date();
  const loaded = await loadProposalForViewer(db, viewer, id, now);
  const { proposal, cycle, members, abilities } = loaded;
  const [details, missing] = await Promise.all([
    loadProposalDetails(db, id, cycle.id, viewer.user.id),
    missingForSubmission(db, proposal),
  ]);
  const [piRow] = await db
    .select({ name: users.name, email: users.email, institute: users.institute })
    .from(users)
    .where(eq(users.id, proposal.piId));
  const hoursBy = new Map(details.hours.map((h) => [h.configurationId, h.hours]));
  return {
    proposal: {
      id: proposal.id,
      title: proposal.title,
      abstract: proposal.abstract,
      scienceCategory: proposal.scienceCategory,
      bandId: proposal.bandId,
      status: proposal.status as StatusKey,
      statusLabel: STATUS_WORDS[proposal.status],
      currentVersion: proposal.currentVersion,
      submittedAt: proposal.submittedAt?.toISOString() ?? null,
      updatedAt: proposal.updatedAt.toISOString(),
    },
    cycle: {
      name: cycle.name,
      observing: `${cycle.observingStart} to ${cycle.observingEnd}`,
      deadline: formatUtc(cycle.submissionDeadline),
      countdown: deadlineCountdown(cycle.submissionDeadline, now),
    },
    pi: piRow ?? { name: "?", email: "", institute: "" },
    members: members.map((m) => ({
      id: m.id,
      email: m.email,
      name: details.memberUsers.find((u) => u.memberId === m.id)?.name ?? null,
    })),
    abilities,
    configurations: details.offered.map((c) => ({
      id: c.id,
      name: c.name,
      description: c.description,
      stations: c.stationNames,
      hours: hoursBy.get(c.id) ?? null,
    })),
    requestedElsewhere: details.hours.filter((h) => !details.offered.some((c) => c.id === h.configurationId)),
    bands: details.bands.map((b) => ({
      id: b.band.id,
      label: `${b.instrumentName} — ${b.band.name} (${(b.band.centralWavelengthM * 1e6).toFixed(2)} µm, limit ${b.band.limitingMagnitude} mag)`,
    })),
    targets: details.targets.map((t) => ({
      id: t.id,
      name: t.name,
      raDeg: t.raDeg,
      decDeg: t.decDeg,
      model: describeModel(t.model),
      magnitudes: describeMagnitudes(t.magnitudes),
      minElevationDeg: t.minElevationDeg,
      windows: t.timeWindows.length,
      calibrators: t.calibrators.map((c) => c.name),
    })),
    myTargets: details.myTargets.map((t) => ({ id: t.id, name: t.name })),
    document: details.document
      ? {
          filename: details.document.filename,
          size: formatBytes(details.document.sizeBytes),
          sha256: details.document.sha256,
          uploadedAt: details.document.uploadedAt.toISOString(),
          uploadedBy: details.document.uploadedBy,
        }
      : null,
    versions: details.versions.map((x) => ({ ...x, submittedAt: x.submittedAt.toISOString() })),
    missing,
    limits: { ...L, pdfBytes: MAX_PDF_BYTES, pdfLabel: formatBytes(MAX_PDF_BYTES) },
    categories: [...SCIENCE_CATEGORIES],
  };
}

// ---------------------------------------------------------------- action

export async function action({ request, params }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  const id = proposalIdFrom(params.proposalId);
  const db = database();
  const here = `/proposals/${id}`;
  // Someone who may not see the proposal gets the 404 before anything they sent is read.
  await loadProposalForViewer(db, viewer, id);

  if (isMultipart(request)) {
    const read = await readMultipartCapped(request);
    if (!read.ok) return fail("upload-document", { document: read.message }, read.status);
    const intent = String(read.form.get("intent") ?? "");
    if (intent !== "upload-document") return fail(intent, { form: "Unknown action." }, 400);
    const file = read.form.get("document");
    if (!(file instanceof File) || file.size === 0)
      return fail(intent, { document: "Science case: choose a PDF file to upload." }, 400);
    if (file.size > MAX_PDF_BYTES) {
      return fail(
        intent,
        {
          document: `Science case: the file is ${formatBytes(file.size)}, larger than the ${formatBytes(MAX_PDF_BYTES)} limit. Please upload a smaller PDF (compress the figures).`,
        },
        413,
      );
    }
    try {
      const stored = await uploadScienceCase(db, viewer, id, {
        filename: file.name,
        bytes: new Uint8Array(await file.arrayBuffer()),
      });
      return redirectWithFlash(here, {
        kind: "success",
        text: `Science case uploaded: ${stored.filename} (${formatBytes(stored.sizeBytes)}).`,
      });
    } catch (e) {
      if (e instanceof ProposalRefusal) return fail(intent, { [e.field ?? "document"]: e.message }, e.status);
      throw e;
    }
  }

  const read = await readFormCapped(request);
  if (!read.ok) return fail("form", { form: read.message }, read.status);
  const form = read.form;
  const intent = String(form.get("intent") ?? "");
  const str = (k: string) => {
    const x = form.get(k);
    return typeof x === "string" ? x : "";
  };

  try {
    switch (intent) {
      case "save":
      case "autosave": {
        const values = {
          title: str("title"),
          abstract: str("abstract"),
          scienceCategory: str("scienceCategory"),
          bandId: str("bandId"),
        };
        const parsed = v.safeParse(DetailsSchema, values);
        if (!parsed.success) return fail(intent, firstErrors(parsed.issues), 400, values);
        const row = await saveDetails(db, viewer, id, parsed.output);
        if (intent === "autosave")
          return { intent, errors: {}, savedAt: row.updatedAt.toISOString() } satisfies ActionResult;
        return redirectWithFlash(here, { kind: "success", text: "Proposal text saved." });
      }
      case "hours": {
        const values: Values = {};
        const errors: Record<string, string> = {};
        const lines: { configurationId: number; hours: number }[] = [];
        for (const [key, raw] of form.entries()) {
          const m = /^hours-(\d{1,9})$/.exec(key);
          if (!m || typeof raw !== "string") continue;
          values[key] = raw;
          const label = str(`label-${m[1]}`) || "this configuration";
          const parsed = v.safeParse(HoursSchema, raw);
          if (!parsed.success) errors[key] = `Hours for ${label}: ${parsed.issues[0].message}.`;
          else if (parsed.output !== null) lines.push({ configurationId: Number(m[1]), hours: parsed.output });
        }
        if (Object.keys(errors).length > 0) return fail(intent, errors, 400, values);
        await saveHours(db, viewer, id, lines);
        return redirectWithFlash(here, {
          kind: "success",
          text: lines.length
            ? `Requested hours saved (${lines.reduce((a, l) => a + l.hours, 0)} h in all).`
            : "Requested hours cleared.",
        });
      }
      case "add-member": {
        const values = { email: str("email") };
        const parsed = v.safeParse(EmailSchema, values.email);
        if (!parsed.success) return fail(intent, { email: parsed.issues[0].message }, 400, values);
        const member = await addCoInvestigator(db, viewer, id, parsed.output);
        wakeOutboxSender();
        return redirectWithFlash(here, {
          kind: "success",
          text: `${member.email} is now a co-investigator and has been sent a notice.`,
        });
      }
      case "remove-member": {
        const parsed = v.safeParse(IdSchema, str("memberId"));
        if (!parsed.success) return fail(intent, { form: "Unknown co-investigator." }, 400);
        const gone = await removeCoInvestigator(db, viewer, id, parsed.output);
        return redirectWithFlash(here, { kind: "success", text: `${gone.email} is no longer on the team.` });
      }
      case "add-my-target": {
        const values = { myTargetId: str("myTargetId") };
        const parsed = v.safeParse(IdSchema, values.myTargetId);
        if (!parsed.success)
          return fail(intent, { myTargetId: "From my targets: choose one of your targets." }, 400, values);
        const row = await addTargetFromMine(db, viewer, id, parsed.output);
        return redirectWithFlash(here, {
          kind: "success",
          text: `${row.name} added from your targets. Set its constraints and calibrators with Edit.`,
        });
      }
      case "move-target": {
        const parsed = v.safeParse(IdSchema, str("targetId"));
        const direction = str("direction");
        if (!parsed.success || (direction !== "up" && direction !== "down"))
          return fail(intent, { form: "Unknown target or direction." }, 400);
        await moveTarget(db, viewer, id, parsed.output, direction);
        return redirectWithFlash(here, { kind: "info", text: "Target order changed." });
      }
      case "remove-target": {
        const parsed = v.safeParse(IdSchema, str("targetId"));
        if (!parsed.success) return fail(intent, { form: "Unknown target." }, 400);
        const gone = await removeTarget(db, viewer, id, parsed.output);
        return redirectWithFlash(here, { kind: "success", text: `${gone.name} removed from the proposal.` });
      }
      case "remove-document": {
        await removeScienceCase(db, viewer, id);
        return redirectWithFlash(here, { kind: "success", text: "Science case removed." });
      }
      case "submit": {
        const { version } = await submitProposal(db, viewer, id);
        wakeOutboxSender();
        return redirectWithFlash(here, {
          kind: "success",
          text: `Submitted. Version ${version} is frozen for the committee; the team has been sent a notice.`,
        });
      }
      case "withdraw": {
        await withdrawProposal(db, viewer, id);
        wakeOutboxSender();
        return redirectWithFlash(here, {
          kind: "success",
          text: "Proposal withdrawn; the team has been sent a notice.",
        });
      }
      case "reopen": {
        await reopenProposal(db, viewer, id);
        return redirectWithFlash(here, {
          kind: "success",
          text: "Reopened as a draft. Submit it again before the deadline.",
        });
      }
      default:
        return fail(intent, { form: "Unknown action." }, 400);
    }
  } catch (e) {
    if (e instanceof ProposalRefusal) {
      const values: Values = {};
      for (const [k, x] of form.entries()) if (typeof x === "string" && k !== "intent") values[k] = x;
      return fail(intent, { [e.field ?? "form"]: e.message }, e.status, values);
    }
    throw e;
  }
}

/** Autosave answers with a time only; the page's data has not changed for anyone else to see. */
export function shouldRevalidate({ formData, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  if (formData?.get("intent") === "autosave") return false;
  return defaultShouldRevalidate;
}

export const meta: Route.MetaFunction = ({ data }) => [
  { title: `${data?.proposal.title || "Proposal"} — Fringe Docket` },
];

// ---------------------------------------------------------------- page

type LoaderData = Route.ComponentProps["loaderData"];

function pick(actionData: ActionResult | undefined, intent: string) {
  return actionData?.intent === intent ? actionData : undefined;
}

export default function ProposalEditor({ loaderData, actionData }: Route.ComponentProps) {
  const d = loaderData;
  const result = actionData as ActionResult | undefined;
  const editable = d.abilities.canEdit;
  const formError = result?.errors.form;
  return (
    <>
      <PageHeader
        title={d.proposal.title || "(untitled proposal)"}
        lead={
          <>
            <StatusBadge status={d.proposal.status} label={d.proposal.statusLabel} /> Cycle{" "}
            <span className="font-medium">{d.cycle.name}</span> · observing {d.cycle.observing} · deadline{" "}
            {d.cycle.deadline}
            {d.proposal.status === "draft" ? ` (${d.cycle.countdown})` : ""}
          </>
        }
        actions={
          <>
            <ButtonLink to={`/proposals/${d.proposal.id}/feasibility`} variant="secondary">
              Feasibility report
            </ButtonLink>
            <ButtonLink to="/proposals" variant="ghost">
              My proposals
            </ButtonLink>
          </>
        }
      />
      {formError && !["submit", "withdraw", "reopen"].includes(result?.intent ?? "") ? (
        <div className="mb-4">
          <FormErrors errors={[formError]} />
        </div>
      ) : null}
      {!editable && d.abilities.lockedBecause ? (
        <p className="mb-4 rounded-lg bg-info-50 p-3 text-sm text-info-700 ring-1 ring-info-700/20">
          {d.abilities.lockedBecause} What you see is read-only.
        </p>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="grid content-start gap-6">
          <DetailsCard d={d} result={pick(result, "save") ?? pick(result, "autosave")} />
          <HoursCard d={d} result={pick(result, "hours")} />
          <TargetsCard d={d} result={pick(result, "add-my-target")} />
        </div>
        <div className="grid content-start gap-6">
          <SubmitCard
            d={d}
            result={result && ["submit", "withdraw", "reopen"].includes(result.intent) ? result : undefined}
          />
          <TeamCard d={d} result={pick(result, "add-member")} />
          <DocumentCard d={d} result={pick(result, "upload-document")} />
          <VersionsCard d={d} />
        </div>
      </div>
      {editable ? null : <span className="sr-only">read-only</span>}
    </>
  );
}

function DetailsCard({ d, result }: { d: LoaderData; result?: ActionResult }) {
  const editable = d.abilities.canEdit;
  const fetcher = useFetcher<ActionResult>({ key: `autosave-${d.proposal.id}` });
  const formRef = useRef<HTMLFormElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const [dirty, setDirty] = useState(false);
  const values = result?.values;
  const [words, setWords] = useState(() => countWords(values?.abstract ?? d.proposal.abstract));
  const errors: Record<string, string | undefined> = fetcher.data ? fetcher.data.errors : (result?.errors ?? {});
  const autosaveErrors =
    fetcher.data && Object.keys(fetcher.data.errors).length > 0 ? Object.values(fetcher.data.errors) : null;

  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );

  useEffect(() => {
    if (fetcher.state === "idle" && fetcher.data?.savedAt) setDirty(false);
  }, [fetcher.state, fetcher.data]);

  function scheduleAutosave() {
    setDirty(true);
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      const el = formRef.current;
      if (!el) return;
      const fd = new FormData(el);
      fd.set("intent", "autosave");
      void fetcher.submit(fd, { method: "post" });
    }, 1000);
  }

  let status: string;
  if (fetcher.state !== "idle") status = "Saving…";
  else if (autosaveErrors) status = "Not saved: fix the field marked below.";
  else if (dirty) status = "Unsaved changes";
  else if (fetcher.data?.savedAt)
    status = `Saved ${new Date(fetcher.data.savedAt).toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" })}`;
  else status = `Last change ${fmtUtc(d.proposal.updatedAt)}`;

  if (!editable) {
    const band = d.bands.find((b) => b.id === d.proposal.bandId);
    return (
      <Card title="Proposal">
        <dl className="grid gap-3 text-sm">
          <div>
            <dt className="text-night-600">Science category</dt>
            <dd className="font-medium">{d.proposal.scienceCategory || "—"}</dd>
          </div>
          <div>
            <dt className="text-night-600">Instrument and band</dt>
            <dd className="font-medium">{band?.label ?? "—"}</dd>
          </div>
          <div>
            <dt className="text-night-600">Abstract ({countWords(d.proposal.abstract)} words)</dt>
            <dd className="whitespace-pre-wrap text-night-900">{d.proposal.abstract || "—"}</dd>
          </div>
        </dl>
      </Card>
    );
  }

  return (
    <Card
      title="Proposal"
      actions={
        <span
          role="status"
          aria-live="polite"
          className={cx("text-sm", autosaveErrors ? "font-medium text-danger-700" : "text-night-600")}
          data-testid="autosave-status"
        >
          {status}
        </span>
      }
    >
      <Form
        method="post"
        ref={formRef}
        className="grid gap-4"
        onChange={scheduleAutosave}
        noValidate
        aria-label="Proposal text"
      >
        <TextField
          label="Title"
          name="title"
          defaultValue={values?.title ?? d.proposal.title}
          error={errors.title}
          maxLength={d.limits.titleMaxChars}
        />
        <div className="space-y-1">
          <TextArea
            label="Abstract"
            name="abstract"
            rows={8}
            defaultValue={values?.abstract ?? d.proposal.abstract}
            error={errors.abstract}
            onChange={(e) => setWords(countWords(e.currentTarget.value))}
            hint={`What you will measure and why the array is needed. At most ${d.limits.abstractMaxWords} words.`}
          />
          <p
            className={cx(
              "num text-right text-sm",
              words > d.limits.abstractMaxWords ? "font-semibold text-danger-700" : "text-night-600",
            )}
            aria-live="polite"
          >
            {words} / {d.limits.abstractMaxWords} words
          </p>
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField
            label="Science category"
            name="scienceCategory"
            defaultValue={values?.scienceCategory ?? d.proposal.scienceCategory}
            error={errors.scienceCategory}
          >
            <option value="">— choose —</option>
            {d.categories.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </SelectField>
          <SelectField
            label="Instrument and band"
            name="bandId"
            defaultValue={values?.bandId ?? (d.proposal.bandId === null ? "" : String(d.proposal.bandId))}
            error={errors.bandId}
          >
            <option value="">— choose —</option>
            {d.bands.map((b) => (
              <option key={b.id} value={b.id}>
                {b.label}
              </option>
            ))}
          </SelectField>
        </div>
        <p className="text-sm text-night-600">Cycle: {d.cycle.name} (fixed once the proposal exists).</p>
        <div>
          <Button type="submit" name="intent" value="save" variant="secondary">
            Save now
          </Button>
        </div>
      </Form>
    </Card>
  );
}

function HoursCard({ d, result }: { d: LoaderData; result?: ActionResult }) {
  const editable = d.abilities.canEdit;
  const total = d.configurations.reduce((a, c) => a + (c.hours ?? 0), 0);
  return (
    <Card
      title="Requested hours"
      actions={<span className="num text-sm text-night-600">{total.toFixed(1)} h in all</span>}
    >
      {d.configurations.length === 0 ? (
        <p className="text-sm text-night-600">This cycle offers no configuration yet.</p>
      ) : null}
      <Form method="post" className="grid gap-3" noValidate aria-label="Requested hours">
        <input type="hidden" name="intent" value="hours" />
        <div className="grid gap-3 sm:grid-cols-3">
          {d.configurations.map((c) => {
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
                  disabled={!editable}
                  hint={`${c.stations.length} stations: ${c.stations.join(", ")}`}
                  placeholder="none"
                />
              </div>
            );
          })}
        </div>
        {editable && d.configurations.length > 0 ? (
          <div>
            <Button type="submit" variant="secondary">
              Save hours
            </Button>
            <span className="ml-3 text-sm text-night-600">
              Leave a configuration empty to request none; at most {d.limits.hoursMax} h each.
            </span>
          </div>
        ) : null}
      </Form>
    </Card>
  );
}

function TargetsCard({ d, result }: { d: LoaderData; result?: ActionResult }) {
  const editable = d.abilities.canEdit;
  const base = `/proposals/${d.proposal.id}`;
  return (
    <Card
      title={`Targets (${d.targets.length})`}
      actions={
        editable ? (
          <ButtonLink to={`${base}/targets/new`} size="sm">
            Add a target
          </ButtonLink>
        ) : null
      }
    >
      {d.targets.length === 0 ? (
        <p className="mb-3 text-sm text-night-600">No target yet. Type one in, or copy one of your own targets.</p>
      ) : null}
      {d.targets.length > 0 ? (
        <ol className="divide-y divide-night-100 rounded-lg ring-1 ring-night-200">
          {d.targets.map((t, i) => (
            <li key={t.id} className="flex flex-col gap-2 p-3 sm:flex-row sm:items-start sm:gap-3">
              <div className="min-w-0 flex-1">
                <p className="font-semibold text-night-900">
                  <span className="num mr-2 font-normal text-night-500">{i + 1}.</span>
                  {t.name}
                </p>
                <p className="num text-sm text-night-700">
                  RA {t.raDeg.toFixed(4)}°, Dec {t.decDeg.toFixed(4)}° · {t.model} · {t.magnitudes}
                </p>
                <p className="text-sm text-night-600">
                  {t.minElevationDeg === null ? "the array's elevation limit" : `elevation ≥ ${t.minElevationDeg}°`} ·{" "}
                  {t.windows} time window{t.windows === 1 ? "" : "s"} ·{" "}
                  {t.calibrators.length ? `calibrators ${t.calibrators.join(", ")}` : "no calibrator yet"}
                </p>
              </div>
              <div className="flex flex-wrap gap-1">
                <ButtonLink
                  to={`${base}/targets/${t.id}`}
                  size="sm"
                  variant="secondary"
                  aria-label={`${editable ? "Edit" : "View"} ${t.name}`}
                >
                  {editable ? "Edit" : "View"}
                </ButtonLink>
                {editable ? (
                  <>
                    <Form method="post">
                      <input type="hidden" name="intent" value="move-target" />
                      <input type="hidden" name="targetId" value={t.id} />
                      <input type="hidden" name="direction" value="up" />
                      <Button
                        type="submit"
                        size="sm"
                        variant="ghost"
                        disabled={i === 0}
                        aria-label={`Move ${t.name} up`}
                      >
                        ↑
                      </Button>
                    </Form>
                    <Form method="post">
                      <input type="hidden" name="intent" value="move-target" />
                      <input type="hidden" name="targetId" value={t.id} />
                      <input type="hidden" name="direction" value="down" />
                      <Button
                        type="submit"
                        size="sm"
                        variant="ghost"
                        disabled={i === d.targets.length - 1}
                        aria-label={`Move ${t.name} down`}
                      >
                        ↓
                      </Button>
                    </Form>
                    <Form method="post">
                      <input type="hidden" name="intent" value="remove-target" />
                      <input type="hidden" name="targetId" value={t.id} />
                      <Button type="submit" size="sm" variant="ghost" aria-label={`Remove ${t.name}`}>
                        Remove
                      </Button>
                    </Form>
                  </>
                ) : null}
              </div>
            </li>
          ))}
        </ol>
      ) : null}
      {editable ? (
        <Form method="post" className="mt-4 flex flex-wrap items-end gap-3" aria-label="Copy from my targets">
          <input type="hidden" name="intent" value="add-my-target" />
          <div className="min-w-56 flex-1">
            <SelectField
              label="From my targets"
              name="myTargetId"
              defaultValue={result?.values?.myTargetId ?? ""}
              error={result?.errors.myTargetId}
              disabled={d.myTargets.length === 0}
              hint={
                d.myTargets.length === 0 ? (
                  <>
                    Your list is empty; targets you keep under{" "}
                    <Link className="underline" to="/targets">
                      My targets
                    </Link>{" "}
                    show here.
                  </>
                ) : undefined
              }
            >
              <option value="">— choose —</option>
              {d.myTargets.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </SelectField>
          </div>
          <Button type="submit" variant="secondary" disabled={d.myTargets.length === 0}>
            Copy into the proposal
          </Button>
        </Form>
      ) : null}
    </Card>
  );
}

function TeamCard({ d, result }: { d: LoaderData; result?: ActionResult }) {
  const manage = d.abilities.canManageTeam;
  return (
    <Card title="Team">
      <ul className="grid gap-2 text-sm">
        <li className="flex items-center gap-2">
          <Badge tone="accent">PI</Badge>
          <span className="font-medium">{d.pi.name}</span>
          <span className="text-night-600">{d.pi.email}</span>
        </li>
        {d.members.map((m) => (
          <li key={m.id} className="flex items-start gap-2">
            <Badge>Co-I</Badge>
            <span className="min-w-0 flex-1">
              <span className="font-medium">{m.name ?? "(no account yet)"}</span>{" "}
              <span className="break-all text-night-600">{m.email}</span>
            </span>
            {manage ? (
              <Form method="post">
                <input type="hidden" name="intent" value="remove-member" />
                <input type="hidden" name="memberId" value={m.id} />
                <Button type="submit" size="sm" variant="ghost" aria-label={`Remove ${m.email}`}>
                  Remove
                </Button>
              </Form>
            ) : null}
          </li>
        ))}
      </ul>
      {manage ? (
        <Form
          method="post"
          className="mt-4 flex flex-wrap items-end gap-3"
          noValidate
          aria-label="Add a co-investigator"
        >
          <input type="hidden" name="intent" value="add-member" />
          <div className="min-w-56 flex-1">
            <TextField
              label="Co-investigator e-mail"
              name="email"
              type="email"
              defaultValue={result?.values?.email ?? ""}
              error={result?.errors.email}
              autoComplete="off"
            />
          </div>
          <Button type="submit" variant="secondary">
            Add
          </Button>
        </Form>
      ) : (
        <p className="mt-3 text-sm text-night-600">
          {d.abilities.relation === "co-investigator" && d.abilities.canEdit ? "Only the PI changes the team." : null}
        </p>
      )}
    </Card>
  );
}

function DocumentCard({ d, result }: { d: LoaderData; result?: ActionResult }) {
  const editable = d.abilities.canEdit;
  const [clientError, setClientError] = useState<string | null>(null);
  const navigation = useNavigation();
  const uploading = navigation.state === "submitting" && navigation.formEncType === "multipart/form-data";
  function check(e: FormEvent<HTMLFormElement>) {
    const input = e.currentTarget.elements.namedItem("document") as HTMLInputElement | null;
    const file = input?.files?.[0];
    if (!file) {
      e.preventDefault();
      setClientError("Science case: choose a PDF file to upload.");
    } else if (file.size > d.limits.pdfBytes) {
      e.preventDefault();
      setClientError(
        `Science case: the file is ${formatBytes(file.size)}; the limit is ${d.limits.pdfLabel}. Please upload a smaller PDF.`,
      );
    } else setClientError(null);
  }
  const error = clientError ?? result?.errors.document;
  return (
    <Card title="Science case (PDF)">
      {d.document ? (
        <div className="mb-3 text-sm">
          <a
            href={`/proposals/${d.proposal.id}/science-case`}
            className="font-medium text-ember-800 underline"
            download
          >
            {d.document.filename}
          </a>{" "}
          <span className="text-night-600">
            · {d.document.size} · uploaded {fmtUtc(d.document.uploadedAt)}
            {d.document.uploadedBy ? ` by ${d.document.uploadedBy}` : ""}
          </span>
          <p className="num mt-1 break-all text-xs text-night-500">SHA-256 {d.document.sha256}</p>
        </div>
      ) : (
        <p className="mb-3 text-sm text-night-600">No science case yet.</p>
      )}
      {editable ? (
        <>
          <Form
            key={d.document?.sha256 ?? "none"}
            method="post"
            encType="multipart/form-data"
            onSubmit={check}
            className="grid gap-3"
            aria-label="Upload the science case"
          >
            <input type="hidden" name="intent" value="upload-document" />
            <div className="space-y-1">
              <label htmlFor="document" className="block text-sm font-medium text-night-800">
                {d.document ? "Replace with" : "PDF file"}
              </label>
              <input
                id="document"
                name="document"
                type="file"
                accept="application/pdf,.pdf"
                aria-invalid={error ? true : undefined}
                aria-describedby={error ? "document-error" : "document-hint"}
                className="block w-full text-sm file:mr-3 file:rounded-lg file:border-0 file:bg-night-100 file:px-3 file:py-2 file:font-medium file:text-night-800"
                onChange={() => setClientError(null)}
              />
              {error ? (
                <p id="document-error" role="alert" className="text-sm font-medium text-danger-700">
                  {error}
                </p>
              ) : (
                <p id="document-hint" className="text-sm text-night-600">
                  A PDF of at most {d.limits.pdfLabel}. It is checked by its content, not its name.
                </p>
              )}
            </div>
            <div>
              <Button type="submit" variant="secondary" disabled={uploading}>
                {uploading ? "Uploading…" : "Upload"}
              </Button>
            </div>
          </Form>
          {d.document ? (
            <Form method="post" className="mt-2">
              <input type="hidden" name="intent" value="remove-document" />
              <Button type="submit" size="sm" variant="ghost">
                Remove the PDF
              </Button>
            </Form>
          ) : null}
        </>
      ) : null}
    </Card>
  );
}

function SubmitCard({ d, result }: { d: LoaderData; result?: ActionResult }) {
  const a = d.abilities;
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" && navigation.formData?.get("intent") === "submit";
  const message = result?.errors.form;
  if (d.proposal.status === "draft") {
    return (
      <Card title="Submit">
        {message ? (
          <p
            role="alert"
            className="mb-3 rounded-lg bg-danger-50 p-3 text-sm font-medium text-danger-700 ring-1 ring-danger-700/20"
          >
            {message}
          </p>
        ) : null}
        {a.deadlinePassed ? (
          <p className="text-sm text-night-700">
            The deadline ({d.cycle.deadline}) has passed; this draft can no longer be submitted.
          </p>
        ) : d.missing.length > 0 ? (
          <>
            <p className="text-sm text-night-700">Before it can be submitted, the proposal still needs:</p>
            <ul className="mt-2 list-disc pl-5 text-sm text-night-800" aria-label="Missing before submission">
              {d.missing.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          </>
        ) : (
          <p className="text-sm text-night-700">
            Complete. Submitting freezes this version, with its feasibility report and PDF, for the committee; the team
            gets a notice. Deadline: {d.cycle.deadline} ({d.cycle.countdown}).
          </p>
        )}
        {a.canSubmit ? (
          <Form method="post" className="mt-4">
            <input type="hidden" name="intent" value="submit" />
            <Button type="submit" disabled={busy || d.missing.length > 0}>
              {busy ? "Submitting…" : "Submit the proposal"}
            </Button>
          </Form>
        ) : null}
      </Card>
    );
  }
  return (
    <Card title="Status">
      {message ? (
        <p
          role="alert"
          className="mb-3 rounded-lg bg-danger-50 p-3 text-sm font-medium text-danger-700 ring-1 ring-danger-700/20"
        >
          {message}
        </p>
      ) : null}
      <p className="flex items-center gap-2 text-sm">
        <StatusBadge status={d.proposal.status} label={d.proposal.statusLabel} />
        {d.proposal.submittedAt ? (
          <span className="text-night-700">
            version {d.proposal.currentVersion} submitted {fmtUtc(d.proposal.submittedAt)}
          </span>
        ) : null}
      </p>
      {a.canWithdraw ? (
        <Form method="post" className="mt-4">
          <input type="hidden" name="intent" value="withdraw" />
          <p className="mb-2 text-sm text-night-700">
            Withdrawing takes the proposal out of the committee's hands. Until the deadline you can reopen it as a draft
            and submit it again.
          </p>
          <Button type="submit" variant="danger">
            Withdraw the proposal
          </Button>
        </Form>
      ) : null}
      {a.canReopen ? (
        <Form method="post" className="mt-4">
          <input type="hidden" name="intent" value="reopen" />
          <p className="mb-2 text-sm text-night-700">
            The deadline has not passed: you can turn it back into a draft, change it and submit a new version.
          </p>
          <Button type="submit" variant="secondary">
            Reopen as a draft
          </Button>
        </Form>
      ) : null}
    </Card>
  );
}

function VersionsCard({ d }: { d: LoaderData }) {
  if (d.versions.length === 0) return null;
  return (
    <Card title="Submitted versions">
      <ul className="grid gap-2 text-sm">
        {d.versions.map((x) => (
          <li key={x.version} className="flex flex-wrap items-center gap-2">
            <Link
              to={`/proposals/${d.proposal.id}/versions/${x.version}`}
              className="font-medium text-ember-800 underline"
            >
              Version {x.version}
            </Link>
            <span className="text-night-600">
              {fmtUtc(x.submittedAt)}
              {x.submittedBy ? ` by ${x.submittedBy}` : ""}
            </span>
            {x.documentSha256 ? (
              <a
                href={`/proposals/${d.proposal.id}/science-case?version=${x.version}`}
                className="ml-auto text-ember-800 underline"
                download
              >
                PDF
              </a>
            ) : null}
          </li>
        ))}
      </ul>
    </Card>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
