/**
 * Who is asking, and may they? Guards for the first line of every loader and action:
 * `requireUser`, `requirePermission`, `requireRole` for pages (a browser session only), and
 * `requireApiUser` for the JSON API (a session cookie, or an `Authorization: Bearer` token holding
 * the scope the call needs; 401/403 JSON otherwise).
 *
 * A personal API token never opens a page: not the account page (where tokens are made), not the
 * People page, not any other. Pages see a request that carries only a token as a 403.
 */
import { data, href, redirect } from "react-router";
import { database } from "~/db/client.server";
import type { Role } from "~/db/schema/users";
import { rolesOf } from "~/services/auth/accounts.server";
import { checkApiToken } from "~/services/auth/api-tokens.server";
import { SESSION_COOKIE } from "~/services/auth/config.server";
import { readCookie, validateSessionToken } from "~/services/auth/sessions.server";
import { formatUtc } from "./format";
import { type Permission, permissionsFor, type TokenScope } from "./permissions";

export type Viewer = {
  user: { id: number; email: string; name: string; institute: string };
  roles: Role[];
  permissions: Set<Permission>;
  /** Hash id of the browser session, or null when the request came with an API token. */
  sessionId: string | null;
  via: "session" | "token";
  /** What the token may do; null for a browser session (everything the roles allow). */
  scopes: ReadonlySet<TokenScope> | null;
};

type ApiAttempt = { viewer: Viewer } | { viewer: null; problem: string | null };

const sessionCache = new WeakMap<Request, Promise<Viewer | null>>();
const apiCache = new WeakMap<Request, Promise<ApiAttempt>>();

function pick(u: { id: number; email: string; name: string; institute: string }) {
  return { id: u.id, email: u.email, name: u.name, institute: u.institute };
}

async function resolveSessionViewer(request: Request): Promise<Viewer | null> {
  const token = readCookie(request, SESSION_COOKIE);
  if (!token) return null;
  const db = database();
  const found = await validateSessionToken(db, token);
  if (!found) return null;
  const roles = await rolesOf(db, found.user.id);
  return {
    user: pick(found.user),
    roles,
    permissions: permissionsFor(roles, { signedIn: true }),
    sessionId: found.session.id,
    via: "session",
    scopes: null,
  };
}

function bearerToken(request: Request): string | null {
  const auth = request.headers.get("Authorization");
  return auth?.startsWith("Bearer ") ? auth.slice(7).trim() : null;
}

async function resolveApiViewer(request: Request): Promise<ApiAttempt> {
  const token = bearerToken(request);
  if (token === null) return { viewer: await getViewer(request), problem: null };
  const db = database();
  const check = await checkApiToken(db, token);
  if (!check.ok) {
    return {
      viewer: null,
      problem:
        check.reason === "expired"
          ? `This API token expired on ${formatUtc(check.expiresAt)}; create a new one on your account page.`
          : null,
    };
  }
  const roles = await rolesOf(db, check.user.id);
  return {
    viewer: {
      user: pick(check.user),
      roles,
      permissions: permissionsFor(roles, { signedIn: true }),
      sessionId: null,
      via: "token",
      scopes: new Set(check.scopes),
    },
  };
}

/** The person signed in with a browser session, or null. Memoised per request. API tokens do not count. */
export function getViewer(request: Request): Promise<Viewer | null> {
  let pending = sessionCache.get(request);
  if (!pending) {
    pending = resolveSessionViewer(request);
    sessionCache.set(request, pending);
  }
  return pending;
}

function signInRedirect(request: Request) {
  const url = new URL(request.url);
  const next = `${url.pathname}${url.search}`;
  return redirect(`${href("/sign-in")}?next=${encodeURIComponent(next)}`);
}

/** Signed in with a browser session, or redirected to the sign-in page (which returns here afterwards). */
export async function requireUser(request: Request): Promise<Viewer> {
  const viewer = await getViewer(request);
  if (viewer) return viewer;
  if (bearerToken(request) !== null) {
    throw data("An API token opens the JSON API (/api/…) only, never a page; sign in with a browser for this one.", {
      status: 403,
    });
  }
  throw signInRedirect(request);
}

export function forbidden(message = "Your account does not have the role this page needs."): never {
  throw data(message, { status: 403 });
}

/** Signed in and holding `permission`, or a 403 page. */
export async function requirePermission(request: Request, permission: Permission): Promise<Viewer> {
  const viewer = await requireUser(request);
  if (!viewer.permissions.has(permission)) forbidden();
  return viewer;
}

export async function requireRole(request: Request, role: Role): Promise<Viewer> {
  const viewer = await requireUser(request);
  if (!viewer.roles.includes(role)) forbidden(`This page is for the ${role} role.`);
  return viewer;
}

/**
 * The mailbox: every signed-in person reads the notices addressed to them; administrators
 * (`mailbox:all`) read everyone's, with live one-time sign-in links hidden. The demo mode changes
 * nothing here.
 */
export async function requireMailboxReader(request: Request): Promise<Viewer & { readsAll: boolean }> {
  const viewer = await requirePermission(request, "mailbox:own");
  return { ...viewer, readsAll: viewer.permissions.has("mailbox:all") };
}

function apiRefusal(status: 401 | 403, error: string) {
  const headers: Record<string, string> = { "Cache-Control": "no-store" };
  if (status === 401) headers["WWW-Authenticate"] = 'Bearer realm="fringe-docket"';
  return Response.json({ error, field: null }, { status, headers });
}

/**
 * For `/api/*`: a session cookie or a bearer token, else 401 JSON (never a redirect). With
 * `permission`, the person's roles must grant it (403 JSON otherwise). A token must also hold
 * `scope` (by default "computations:read"; proposal calls name "proposals:read" or
 * "proposals:write").
 */
export async function requireApiUser(
  request: Request,
  permission?: Permission,
  options: { scope?: TokenScope } = {},
): Promise<Viewer> {
  let pending = apiCache.get(request);
  if (!pending) {
    pending = resolveApiViewer(request);
    apiCache.set(request, pending);
  }
  const attempt = await pending;
  if (!attempt.viewer) {
    throw apiRefusal(
      401,
      attempt.problem ?? "Sign in or send a valid API token in the Authorization header (Bearer <token>).",
    );
  }
  const viewer = attempt.viewer;
  if (permission && !viewer.permissions.has(permission)) {
    throw apiRefusal(403, `This call needs the ${permission} permission.`);
  }
  const scope = options.scope ?? "computations:read";
  if (viewer.scopes && !viewer.scopes.has(scope)) {
    throw apiRefusal(403, `This API token does not have the ${scope} scope; create one that has it.`);
  }
  return viewer;
}
