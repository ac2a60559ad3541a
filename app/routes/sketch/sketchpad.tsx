import { ErrorPage } from "~/components/ErrorPage";
import { sketchLoader } from "./+shared/loader.server";
import { sketchShouldRevalidate } from "./+shared/revalidate";
import { SketchPage } from "./+shared/SketchPage";
import { Sketchpad } from "./+shared/Sketchpad";
import type { Route } from "./+types/sketchpad";

export const loader = sketchLoader({ purpose: "anything can be sketched" });

export const shouldRevalidate = sketchShouldRevalidate;

export const meta: Route.MetaFunction = () => [{ title: "Sketchpad — Fringe Docket" }];

export default function SketchpadPage({ loaderData }: Route.ComponentProps) {
  return <SketchPage title="Sketchpad" data={loaderData} Page={Sketchpad} />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
