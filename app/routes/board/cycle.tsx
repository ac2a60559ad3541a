import { data, href } from "react-router";
import * as v from "valibot";
import { CycleLinks } from "~/components/committee/CycleLinks";
import { StateBadge } from "~/components/committee/StateBadge";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { requireFormBody } from "~/lib/body.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { fieldErrors } from "~/lib/form-errors";
import { plural } from "~/lib/format";
import { requirePermission } from "~/lib/guards.server";
import { rowOfParam } from "~/lib/not-found";
import { boardPage } from "~/services/committee/board-page.server";
import { releaseDecisions, saveBoardSettings, saveDecisions } from "~/services/committee/decisions.server";
import { parseDecisionsForm } from "~/services/committee/decisions-form";
import { BoardSettingsSchema } from "~/services/committee/schemas";
import { AllocationWorkbench } from "./+shared/AllocationWorkbench";
import { CalibrationCard } from "./+shared/CalibrationCard";
import { DemandCard } from "./+shared/DemandCard";
import { RankingTable } from "./+shared/RankingTable";
import { SettingsCard } from "./+shared/SettingsCard";
import type { Route } from "./+types/cycle";

function pageOf(db: Parameters<typeof boardPage>[0], raw: string | undefined) {
  return rowOfParam(raw, (cycleId) => boardPage(db, { cycleId }), "No cycle with this number.");
}

export async function loader({ request, params, context }: Route.LoaderArgs) {
  await requirePermission(request, "ranking:board");
  return pageOf(context.get(dbContext), params.cycleId);
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "ranking:board");
  const db = context.get(dbContext);
  const page = await pageOf(db, params.cycleId);
  const cycleId = page.cycle.id;
  const form = await requireFormBody(request, {
    maxBytes: 1_000_000,
    tooLargeMessage: "The decisions form is too large.",
  });
  const intent = String(form.get("intent") ?? "");
  const here = href("/board/:cycleId", { cycleId: String(cycleId) });
  const refuse = (errors: Record<string, string>, status = 400) => data({ intent, errors }, { status });
  switch (intent) {
    case "settings": {
      const parsed = v.safeParse(BoardSettingsSchema, {
        triageAfter: String(form.get("triageAfter") ?? ""),
        disagreementSpread: String(form.get("disagreementSpread") ?? ""),
      });
      if (!parsed.success) return refuse(fieldErrors(parsed.issues));
      const { triageAfter } = parsed.output;
      if (triageAfter !== null && (triageAfter < 1 || triageAfter > page.rows.length))
        return refuse({ triageAfter: `Triage line: a position from 1 to ${page.rows.length}, or empty for none` });
      const result = await saveBoardSettings(db, { cycleId, ...parsed.output, actorId: viewer.user.id });
      if (!result.ok) return refuse({ form: result.message }, 409);
      return redirectWithFlash(here, {
        kind: "success",
        text: triageAfter === null ? "Triage line removed." : `Triage line placed after position ${triageAfter}.`,
      });
    }
    case "save-decisions": {
      const subjects = page.rows
        .filter((r) => r.status === "under_review" && !r.releasedAt)
        .map((r) => ({
          id: r.proposalId,
          title: r.title,
          hours: r.hoursByConfig,
          configNames: Object.fromEntries(page.pressure.configurations.map((c) => [c.configurationId, c.name])),
        }));
      const parsed = parseDecisionsForm(form, subjects, page.cycle.scale);
      if (!parsed.ok) return refuse(parsed.errors);
      const result = await saveDecisions(db, { cycleId, entries: parsed.entries, actorId: viewer.user.id });
      if (!result.ok) return refuse({ form: result.message }, 409);
      return redirectWithFlash(here, {
        kind: "success",
        text: `Grades and decisions of ${plural(result.saved, "proposal")} saved.`,
      });
    }
    case "release": {
      if (form.get("confirm") !== "yes") return refuse({ form: "Confirm the release in the dialog." });
      const result = await releaseDecisions(db, { cycleId, actorId: viewer.user.id });
      if (!result.ok) return refuse({ form: result.message }, 409);
      return redirectWithFlash(here, {
        kind: "success",
        text: `${result.released} decisions sent to the teams; the cycle is closed.`,
      });
    }
    default:
      return refuse({ form: "Unknown action." });
  }
}

export const meta: Route.MetaFunction = ({ data: d }) => [
  { title: `Ranking board — ${d?.cycle.name ?? "Cycle"} — Fringe Docket` },
];

export default function Board({ loaderData: d, actionData }: Route.ComponentProps) {
  const errors = actionData?.errors ?? {};
  const id = String(d.cycle.id);
  const api = `/api/cycles/${id}/board`;
  return (
    <>
      <PageHeader
        title={`Ranking board — ${d.cycle.name}`}
        lead={
          <>
            <StateBadge state={d.cycle.state} /> {plural(d.rows.length, "proposal")} · scale {d.cycle.scaleText} ·
            review deadline <span className="num">{d.cycle.reviewDeadline ?? "not set"}</span>
          </>
        }
        back={{ to: href("/board"), label: "All boards" }}
        actions={
          <>
            <CycleLinks cycleId={id} pages={["cycle", "assignments"]} />
            <a
              className="inline-flex h-10 items-center rounded-lg px-4 font-medium text-night-700 hover:bg-night-100"
              href={`${api}?format=csv`}
              download
            >
              Full board (CSV)
            </a>
          </>
        }
      />
      {errors.form ? <Alert className="mb-4">{errors.form}</Alert> : null}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
        <RankingTable
          rows={d.rows}
          reviewers={d.calibration.reviewers}
          scaleText={d.cycle.scaleText}
          triageAfter={d.settings.triageAfter}
          cycleName={d.cycle.name}
        />
        <SettingsCard
          triageAfter={d.settings.triageAfter}
          disagreementSpread={d.settings.disagreementSpread}
          count={d.rows.length}
          editable={d.abilities.settings}
          errors={actionData?.intent === "settings" ? errors : {}}
        />
        <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
          <DemandCard pressure={d.pressure} />
          <CalibrationCard calibration={d.calibration} scaleText={d.cycle.scaleText} />
        </div>
        <AllocationWorkbench
          key={workbenchKey(d)}
          d={d}
          errors={actionData?.intent === "save-decisions" ? errors : {}}
          answered={actionData}
        />
      </div>
    </>
  );
}

/** Changes whenever the stored decisions or the suggestion change, so the chair's table starts again from them. */
function workbenchKey(d: Route.ComponentProps["loaderData"]) {
  return d.rows
    .map(
      (r) =>
        `${r.proposalId}:${r.decision.decision}:${JSON.stringify(r.decision.hoursByConfig)}:${r.suggestion.decision}:${JSON.stringify(r.suggestion.hoursByConfig)}:${r.finalGrade}`,
    )
    .join("|");
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
