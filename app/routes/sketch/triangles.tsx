import { ErrorPage } from "~/components/ErrorPage";
import { sketchLoader } from "./+shared/loader.server";
import { sketchShouldRevalidate } from "./+shared/revalidate";
import { SketchPage } from "./+shared/SketchPage";
import { TriangleFinder } from "./+shared/TriangleFinder";
import type { Route } from "./+types/triangles";

export const loader = sketchLoader("triangles can be ranked");

export const shouldRevalidate = sketchShouldRevalidate;

export const meta: Route.MetaFunction = () => [{ title: "Triangle finder — Fringe Docket" }];

export default function TriangleFinderPage({ loaderData }: Route.ComponentProps) {
  return <SketchPage title="Triangle finder" data={loaderData} Page={TriangleFinder} />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
