/**
 * Who is asking, and may they? Guards for the first line of every loader and action:
 * `requireUser`, `requirePermission`, `requireRole`, and `requireApiUser` for resource routes
 * (session cookie or `Authorization: Bearer` token; 401 JSON otherwise).
 */
import { data, href, redirect } from "react-router";
import { database } from "~/db/client.server";
import type { Role } from "~/db/schema/users";
import { env } from "~/env.server";
import { rolesOf } from "~/services/auth/accounts.server";
import { authenticateApiToken } from "~/services/auth/api-tokens.server";
import { SESSION_COOKIE } from "~/services/auth/config.server";
import { readCookie, validateSessionToken } from "~/services/auth/sessions.server";
import { type Permission, permissionsFor } from "./permissions";

export type Viewer = {
  user: { id: number; email: string; name: string; institute: string };
  roles: Role[];
  permissions: Set<Permission>;
  /** Hash id of the browser session, or null when the request came with an API token. */
  sessionId: string | null;
  via: "session" | "token";
};

const cache = new WeakMap<Request, Promise<Viewer | null>>();

async function resolveViewer(request: Request): Promise<Viewer | null> {
  const db = database();
  const auth = request.headers.get("Authorization");
  if (auth?.startsWith("Bearer ")) {
    const user = await authenticateApiToken(db, auth.slice(7).trim());
    if (!user) return null;
    const roles = await rolesOf(db, user.id);
    return { user: pick(user), roles, permissions: permissionsFor(roles), sessionId: null, via: "token" };
  }
  const token = readCookie(request, SESSION_COOKIE);
  if (!token) return null;
  const found = await validateSessionToken(db, token);
  if (!found) return null;
  const roles = await rolesOf(db, found.user.id);
  return {
    user: pick(found.user),
    roles,
    permissions: permissionsFor(roles),
    sessionId: found.session.id,
    via: "session",
  };
}

function pick(u: { id: number; email: string; name: string; institute: string }) {
  return { id: u.id, email: u.email, name: u.name, institute: u.institute };
}

/** The signed-in person (by session cookie or API token), or null. Memoised per request. */
export function getViewer(request: Request): Promise<Viewer | null> {
  let pending = cache.get(request);
  if (!pending) {
    pending = resolveViewer(request);
    cache.set(request, pending);
  }
  return pending;
}

function signInRedirect(request: Request) {
  const url = new URL(request.url);
  const next = `${url.pathname}${url.search}`;
  return redirect(`${href("/sign-in")}?next=${encodeURIComponent(next)}`);
}

/** Signed in, or redirected to the sign-in page (which returns here afterwards). */
export async function requireUser(request: Request): Promise<Viewer> {
  const viewer = await getViewer(request);
  if (!viewer) throw signInRedirect(request);
  return viewer;
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

/** The mailbox: administrators, and every signed-in person while the demo mode is on. */
export async function requireMailboxReader(request: Request): Promise<Viewer> {
  const viewer = await requireUser(request);
  if (!viewer.permissions.has("mailbox:read") && env().DEMO_MODE !== "1") forbidden();
  return viewer;
}

/** For `/api/*`: a session cookie or a bearer token, else 401 JSON (never a redirect). */
export async function requireApiUser(request: Request, permission?: Permission): Promise<Viewer> {
  const viewer = await getViewer(request);
  if (!viewer) {
    throw Response.json(
      { error: "Sign in or send a valid API token in the Authorization header (Bearer <token>)." },
      { status: 401, headers: { "WWW-Authenticate": 'Bearer realm="fringe-docket"' } },
    );
  }
  if (permission && !viewer.permissions.has(permission)) {
    throw Response.json({ error: `This call needs the ${permission} permission.` }, { status: 403 });
  }
  return viewer;
}
