import { data, type ShouldRevalidateFunctionArgs } from "react-router";
import type { Route } from "./+types/index";
import { ErrorPage } from "~/components/ErrorPage";
import { TriangleFinder } from "~/components/sketch/TriangleFinder";
import { EmptyState, PageHeader } from "~/components/ui";
import { database } from "~/db/client.server";
import { requirePermission } from "~/services/auth.server";
import { loadSketchRegistry, savedTargetsOf } from "~/services/sketch-registry.server";

export async function loader({ request, url }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "sketch:use");
  const loaded = await loadSketchRegistry(database(), url.searchParams.get("site"));
  if (!loaded) return { loaded: null, savedTargets: [] };
  if (loaded.registry.stations.length < 2 || loaded.registry.instruments.length === 0) {
    throw data("The array registry needs at least two stations and one instrument band before triangles can be ranked.", { status: 404 });
  }
  return { loaded, savedTargets: await savedTargetsOf(viewer) };
}

/** The registry does not change while the inputs are edited: only a different site needs the loader again. */
export function shouldRevalidate({ currentUrl, nextUrl, formMethod, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  if (!formMethod && currentUrl.pathname === nextUrl.pathname && currentUrl.searchParams.get("site") === nextUrl.searchParams.get("site")) {
    return false;
  }
  return defaultShouldRevalidate;
}

export const meta: Route.MetaFunction = () => [{ title: "Triangle finder — Fringe Docket" }];

export default function TriangleFinderPage({ loaderData }: Route.ComponentProps) {
  const { loaded } = loaderData;
  if (!loaded) {
    return (
      <>
        <PageHeader title="Triangle finder" />
        <EmptyState title="No site registered yet">An administrator adds the site, its stations and instruments first.</EmptyState>
      </>
    );
  }
  return (
    <TriangleFinder
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
