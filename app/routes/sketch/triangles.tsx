import { ErrorPage } from "~/components/ErrorPage";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { chooseTriangleAction } from "./+shared/choose-triangle.server";
import { sketchLoader } from "./+shared/loader.server";
import { sketchShouldRevalidate } from "./+shared/revalidate";
import { SketchPage } from "./+shared/SketchPage";
import { TriangleFinder } from "./+shared/TriangleFinder";
import type { Route } from "./+types/triangles";

export const loader = sketchLoader({ purpose: "triangles can be ranked", withProposals: true });

/** "Use this triangle": stores a ranked triangle on a target of one of the viewer's drafts. */
export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "proposals:own");
  return chooseTriangleAction(context.get(dbContext), viewer, request);
}

export const shouldRevalidate = sketchShouldRevalidate;

export const meta: Route.MetaFunction = () => [{ title: "Triangle finder — Fringe Docket" }];

export default function TriangleFinderPage({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <SketchPage
      title="Triangle finder"
      data={loaderData}
      Page={TriangleFinder}
      refusal={actionData?.triangleError ?? null}
    />
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
