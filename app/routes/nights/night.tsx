import { href } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, ButtonLink, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { PLAN_SAFETY_WARNING } from "~/engine";
import { requirePermission } from "~/lib/guards.server";
import { notFound } from "~/lib/not-found";
import { nightPage } from "~/services/nights/queries.server";
import { NightDate } from "~/services/nights/schemas";
import { CandidatesCard } from "./+shared/CandidatesCard";
import { nightAction } from "./+shared/intents.server";
import { PlanCard } from "./+shared/PlanCard";
import { SettingsCard } from "./+shared/SettingsCard";
import { SkyCard } from "./+shared/SkyCard";
import type { Route } from "./+types/night";

/** The night of the address, or the 404 page. */
function dateOf(raw: string | undefined): string {
  const parsed = v.safeParse(NightDate, raw ?? "");
  if (!parsed.success) notFound("There is no night with that date: use YYYY-MM-DD.");
  return parsed.output;
}

export async function loader({ request, params, context }: Route.LoaderArgs) {
  await requirePermission(request, "nights:build");
  const date = dateOf(params.date);
  return { ...(await nightPage(context.get(dbContext), { date })), caution: PLAN_SAFETY_WARNING };
}

export async function action({ request, params, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "nights:build");
  const date = dateOf(params.date);
  return nightAction(request, context.get(dbContext), { date, viewer });
}

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `Night of ${d?.date ?? "…"} — Fringe Docket` }];

export default function NightPage({ loaderData: page }: Route.ComponentProps) {
  const inst = page.installation;
  return (
    <>
      <PageHeader
        title={`Night of ${page.date}`}
        lead={
          inst
            ? `${inst.configurationName} on the array · cycle ${inst.cycleName}. The night begins on the local evening of ${page.date}.`
            : `No configuration is installed on this night. The night begins on the local evening of ${page.date}.`
        }
        back={{
          to: inst ? `${href("/nights")}?cycle=${inst.cycleId}` : href("/nights"),
          label: "Back to the calendar",
        }}
        actions={
          <>
            <ButtonLink
              to={href("/nights/:date", { date: page.previous })}
              variant="ghost"
              aria-label={`Previous night, ${page.previous}`}
            >
              ← {page.previous}
            </ButtonLink>
            <ButtonLink
              to={href("/nights/:date", { date: page.next })}
              variant="ghost"
              aria-label={`Next night, ${page.next}`}
            >
              {page.next} →
            </ButtonLink>
          </>
        }
      />
      <div className="grid grid-cols-1 gap-6">
        {page.sky && page.site ? (
          <SkyCard
            sky={page.sky}
            configuration={inst?.configurationName ?? null}
            stationNames={page.stationNames}
            siteName={page.site.name}
          />
        ) : (
          <Alert tone="info">The array registry has no site yet.</Alert>
        )}
        {!inst ? (
          <Alert tone="info">
            Install a configuration for this night in the nights calendar; then its candidates and plan appear here.
          </Alert>
        ) : (
          <>
            {page.settings ? (
              <SettingsCard
                settings={page.settings}
                editable={!page.plan || page.plan.state === "draft"}
                caution={page.caution}
              />
            ) : null}
            <CandidatesCard candidates={page.candidates} date={page.date} />
            <PlanCard page={page} />
          </>
        )}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
