import { data } from "react-router";
import { ErrorPage } from "~/components/ErrorPage";
import type { Route } from "./+types/not-found";

export function loader(_: Route.LoaderArgs) {
  throw data("No page lives at this address.", { status: 404 });
}

export default function NotFound() {
  return null;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
