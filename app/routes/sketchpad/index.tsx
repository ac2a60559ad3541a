import { data, type ShouldRevalidateFunctionArgs } from "react-router";
import type { Route } from "./+types/index";
import { ErrorPage } from "~/components/ErrorPage";
import { Sketchpad } from "~/components/sketch/Sketchpad";
import { EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { requirePermission } from "~/services/auth.server";
import { loadSketchRegistry, savedTargetsOf } from "~/services/sketch-registry.server";

export async function loader({ request, url }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "sketch:use");
  const loaded = await loadSketchRegistry(database(), url.searchParams.get("site"));
  if (!loaded) return { loaded: null, savedTargets: [] };
  if (loaded.registry.stations.length < 2 || loaded.registry.instruments.length === 0) {
    throw data("The array registry needs at least two stations and one instrument band before anything can be sketched.", { status: 404 });
  }
  return { loaded, savedTargets: await savedTargetsOf(viewer) };
}

/** The registry does not change while a sketch is edited: only a different site needs the loader again. */
export function shouldRevalidate({ currentUrl, nextUrl, formMethod, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  if (!formMethod && currentUrl.pathname === nextUrl.pathname && currentUrl.searchParams.get("site") === nextUrl.searchParams.get("site")) {
    return false;
  }
  return defaultShouldRevalidate;
}

export const meta: Route.MetaFunction = () => [{ title: "Sketchpad — Fringe Docket" }];

export default function SketchpadPage({ loaderData }: Route.ComponentProps) {
  const { loaded } = loaderData;
  if (!loaded) {
    return (
      <>
        <PageHeader title="Sketchpad" />
        <EmptyState title="No site registered yet">An administrator adds the site, its stations and instruments first.</EmptyState>
      </>
    );
  }
  return (
    <Sketchpad
      registry={loaded.registry}
      defaults={loaded.defaults}
      multiSite={loaded.siteNames.length > 1}
      savedTargets={loaderData.savedTargets}
    />
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
