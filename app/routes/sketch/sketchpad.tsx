import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { loadSketchPage } from "~/services/sketch/page.server";
import { sketchShouldRevalidate } from "./+shared/revalidate";
import { SketchPage } from "./+shared/SketchPage";
import { Sketchpad } from "./+shared/Sketchpad";
import type { Route } from "./+types/sketchpad";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  const viewer = await requirePermission(request, "sketch:use");
  return loadSketchPage(context.get(dbContext), { viewer, url, purpose: "anything can be sketched" });
}

export const shouldRevalidate = sketchShouldRevalidate;

export const meta: Route.MetaFunction = () => [{ title: "Sketchpad — Fringe Docket" }];

export default function SketchpadPage({ loaderData }: Route.ComponentProps) {
  return <SketchPage title="Sketchpad" data={loaderData} Page={Sketchpad} />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
