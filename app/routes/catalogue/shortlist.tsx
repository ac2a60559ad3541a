/** The Calibrator shortlist for any target: a star by name, or coordinates; settings in the address. */
import { data } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import { EmptyState, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { invariantResponse } from "~/lib/not-found";
import { shortlistValues } from "~/services/catalogue/schemas";
import { defaultShortlistValues, runShortlist, shortlistChoices } from "~/services/catalogue/shortlist.server";
import { SettingsForm } from "./+shared/SettingsForm";
import { ShortlistResult } from "./+shared/ShortlistResult";
import type { Route } from "./+types/shortlist";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  await requirePermission(request, "sketch:use");
  const choices = await shortlistChoices(context.get(dbContext));
  invariantResponse(choices, "The array registry has no site yet.");
  const params = url.searchParams;
  const values = shortlistValues(params, defaultShortlistValues(choices, new Date()));
  // Nothing is computed until a target is given.
  const asked = ["target", "ra", "dec"].some((k) => (params.get(k) ?? "").trim() !== "");
  const run = asked ? runShortlist(values, choices) : null;
  const failed = run !== null && Object.keys(run.errors).length > 0;
  return data({ choices, values, run }, { status: failed ? 400 : 200 });
}

export const meta: Route.MetaFunction = () => [{ title: "Calibrator shortlist — Fringe Docket" }];

export default function Shortlist({ loaderData }: Route.ComponentProps) {
  const { choices, values, run } = loaderData;
  const name = run?.result?.target.name ?? (values.target || "target");
  return (
    <>
      <PageHeader
        title="Calibrator shortlist"
        lead="Catalogue stars near a target that would calibrate it: nearly unresolved on the longest baseline, up at the same time, of similar brightness in the band."
      />
      <div className="grid grid-cols-1 gap-6">
        <SettingsForm values={values} errors={run?.errors ?? {}} choices={choices} withTarget />
        {run?.result ? (
          <ShortlistResult run={run} exportName={`calibrators-${name.replace(/[^\p{L}\p{N}]+/gu, "-")}`} />
        ) : run === null ? (
          <EmptyState title="No target yet">
            Type a star's name (suggestions appear as you type) or a position, then show the shortlist.
          </EmptyState>
        ) : null}
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
