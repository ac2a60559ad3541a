import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { loadSketchPage } from "~/services/sketch/page.server";
import { sketchShouldRevalidate } from "./+shared/revalidate";
import { SketchPage } from "./+shared/SketchPage";
import { TriangleFinder } from "./+shared/TriangleFinder";
import type { Route } from "./+types/triangles";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "sketch:use");
  return loadSketchPage(context.get(dbContext), { viewer, url, purpose: "triangles can be ranked" });
}

export const shouldRevalidate = sketchShouldRevalidate;

export const meta: Route.MetaFunction = () => [{ title: "Triangle finder — Fringe Docket" }];

export default function TriangleFinderPage({ loaderData }: Route.ComponentProps) {
  return <SketchPage title="Triangle finder" data={loaderData} Page={TriangleFinder} />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
