import { ErrorPage } from "~/components/ErrorPage";
import { sketchShouldRevalidate } from "~/components/sketch/revalidate";
import { Sketchpad } from "~/components/sketch/Sketchpad";
import { EmptyState, PageHeader } from "~/components/ui";
import { requirePermission } from "~/lib/guards.server";
import { loadSketchPage } from "~/services/sketch/page.server";
import type { Route } from "./+types/index";

export async function loader({ request, url }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "sketch:use");
  return loadSketchPage(viewer, url, "anything can be sketched");
}

export const shouldRevalidate = sketchShouldRevalidate;

export const meta: Route.MetaFunction = () => [{ title: "Sketchpad — Fringe Docket" }];

export default function SketchpadPage({ loaderData }: Route.ComponentProps) {
  const { loaded } = loaderData;
  if (!loaded) {
    return (
      <>
        <PageHeader title="Sketchpad" />
        <EmptyState title="No site registered yet">
          An administrator adds the site, its stations and instruments first.
        </EmptyState>
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
