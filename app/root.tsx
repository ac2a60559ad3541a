import type { ReactNode } from "react";
import {
  data,
  Form,
  href,
  Link,
  Links,
  Meta,
  Outlet,
  Scripts,
  ScrollRestoration,
  useRouteLoaderData,
} from "react-router";
import type { Route } from "./+types/root";
import stylesheet from "./app.css?url";
import { ErrorPage } from "./components/ErrorPage";
import { AppShell } from "./components/layout/AppShell";
import { Toast } from "./components/ui/Toast";
import { dbContext } from "./context";
import { database } from "./db/client.server";
import { env } from "./env.server";
import { readFlash } from "./lib/flash.server";
import { getViewer } from "./lib/guards.server";
import { answerFailures, checkRequest, finishResponse } from "./lib/middleware.server";
import { sectionsFor } from "./lib/permissions";
import { crossSiteReason } from "./services/auth/origin.server";

/** Refuses cross-site form posts and API writes before any action runs. */
const refuseCrossSite: Route.MiddlewareFunction = async ({ request }, next) => {
  const reason = crossSiteReason(request);
  if (reason) {
    const wantsJson = new URL(request.url).pathname.startsWith("/api/");
    const message = `Refused: ${reason}.`;
    if (wantsJson) return Response.json({ error: message }, { status: 403 });
    throw data(message, { status: 403 });
  }
  return next();
};

/** Hands every loader and action the database handle through the router context. */
const provideDatabase: Route.MiddlewareFunction = async ({ context }, next) => {
  context.set(dbContext, database());
  return next();
};

/**
 * In order: security headers on every answer (and Retry-After on a 503); cross-site writes refused;
 * the address and body checked (NUL characters, size, content type); the database handle; and,
 * around the loaders and actions, a database outage or an oversized body answered 503 / 413.
 */
export const middleware: Route.MiddlewareFunction[] = [
  finishResponse,
  refuseCrossSite,
  checkRequest,
  provideDatabase,
  answerFailures,
];

export const links: Route.LinksFunction = () => [
  {
    rel: "preload",
    href: "/fonts/ibm-plex-sans-latin-400-normal.woff2",
    as: "font",
    type: "font/woff2",
    crossOrigin: "anonymous",
  },
  {
    rel: "preload",
    href: "/fonts/ibm-plex-sans-latin-600-normal.woff2",
    as: "font",
    type: "font/woff2",
    crossOrigin: "anonymous",
  },
  { rel: "stylesheet", href: stylesheet },
  { rel: "icon", href: "/favicon.svg", type: "image/svg+xml" },
];

export async function loader({ request }: Route.LoaderArgs) {
  const { flash, headers } = await readFlash(request);
  const viewer = await getViewer(request);
  const demoMode = env().DEMO_MODE === "1";
  return data(
    {
      flash,
      viewer: viewer ? { name: viewer.user.name, email: viewer.user.email, roles: viewer.roles } : null,
      sections: sectionsFor(viewer?.roles ?? [], { signedIn: !!viewer }),
      demoMode,
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

function AccountControls({ signedIn }: { signedIn: boolean }) {
  if (!signedIn) {
    return (
      <Link
        to={href("/sign-in")}
        className="rounded-md bg-ember-700 px-3 py-1.5 font-medium text-white hover:bg-ember-800"
      >
        Sign in
      </Link>
    );
  }
  return (
    <>
      <Link to={href("/account")} className="rounded-md px-2 py-1.5 text-night-100 hover:bg-night-800 hover:text-white">
        Account
      </Link>
      <Form method="post" action={href("/sign-out")}>
        <button
          type="submit"
          className="rounded-md px-2 py-1.5 text-night-100 ring-1 ring-night-600 hover:bg-night-800 hover:text-white"
        >
          Sign out
        </button>
      </Form>
    </>
  );
}

type RootData = Awaited<ReturnType<typeof loader>>["data"];

/** The shell around every page, for the viewer of the root loader (nobody when it has not run). */
function Shell({ root, children }: { root: RootData | undefined; children: ReactNode }) {
  return (
    <AppShell
      sections={root?.sections ?? sectionsFor([])}
      viewer={root?.viewer ?? null}
      account={<AccountControls signedIn={!!root?.viewer} />}
    >
      {children}
    </AppShell>
  );
}

export default function App({ loaderData }: Route.ComponentProps) {
  return (
    <Shell root={loaderData}>
      <Toast flash={loaderData.flash} />
      <Outlet />
    </Shell>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return (
    <Shell root={useRouteLoaderData<typeof loader>("root")}>
      <ErrorPage error={error} />
    </Shell>
  );
}
