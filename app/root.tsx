import type { ReactNode } from "react";
import { data, Links, Meta, Outlet, Scripts, ScrollRestoration, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/root";
import stylesheet from "./app.css?url";
import { AppShell } from "./components/layout/AppShell";
import { ErrorPage } from "./components/ErrorPage";
import { Toast } from "./components/ui/Toast";
import { env } from "./env.server";
import { readFlash } from "./services/flash.server";
import { sectionsFor } from "./services/permissions";

export const links: Route.LinksFunction = () => [
  { rel: "preload", href: "/fonts/ibm-plex-sans-latin-400-normal.woff2", as: "font", type: "font/woff2", crossOrigin: "anonymous" },
  { rel: "preload", href: "/fonts/ibm-plex-sans-latin-600-normal.woff2", as: "font", type: "font/woff2", crossOrigin: "anonymous" },
  { rel: "stylesheet", href: stylesheet },
  { rel: "icon", href: "/favicon.svg", type: "image/svg+xml" },
];

export async function loader({ request }: Route.LoaderArgs) {
  const { flash, headers } = await readFlash(request);
  const viewer = null as { name: string; email: string; roles: string[] } | null;
  return data(
    {
      flash,
      viewer,
      sections: sectionsFor([]),
      demoMode: env().DEMO_MODE === "1",
    },
    { headers },
  );
}

export function Layout({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <meta name="color-scheme" content="light" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen bg-night-50">
        {children}
        <ScrollRestoration />
        <Scripts />
      </body>
    </html>
  );
}

export const meta: Route.MetaFunction = () => [
  { title: "Fringe Docket" },
  { name: "description", content: "Proposals, review and night plans for an optical/infrared interferometric array." },
];

export default function App({ loaderData }: Route.ComponentProps) {
  return (
    <AppShell sections={loaderData.sections} viewer={loaderData.viewer}>
      <Toast flash={loaderData.flash} />
      <Outlet />
    </AppShell>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  const rootData = useRouteLoaderData<typeof loader>("root");
  return (
    <AppShell sections={rootData?.sections ?? sectionsFor([])} viewer={rootData?.viewer ?? null}>
      <ErrorPage error={error} />
    </AppShell>
  );
}
