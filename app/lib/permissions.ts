/**
 * What each role may do, as one typed list shared by the server guards and the UI (menus show only
 * what a role can use). Pure: no database or HTTP imports.
 */
import { href } from "react-router";
import type { Role } from "~/db/schema/users";

export { ROLES, type Role } from "~/db/schema/users";

export const PERMISSIONS = [
  "registry:read",
  "registry:edit",
  "sketch:use",
  "proposals:own",
  "review:desk",
  "ranking:board",
  "cycles:read",
  "cycles:manage",
  "nights:build",
  "mailbox:own",
  "mailbox:all",
  "users:manage",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

/** Permissions anybody has, signed in or not. */
export const PUBLIC_PERMISSIONS: readonly Permission[] = ["registry:read"];

/**
 * Permissions every signed-in person has, whatever their roles: reading their own notices (the
 * mailbox stands in for each person's inbox) and the list of observing cycles with their dates.
 * Nothing here depends on the demo mode.
 */
export const SIGNED_IN_PERMISSIONS: readonly Permission[] = ["mailbox:own", "cycles:read"];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  proposer: ["registry:read", "sketch:use", "proposals:own"],
  reviewer: ["registry:read", "sketch:use", "review:desk"],
  chair: ["registry:read", "sketch:use", "review:desk", "ranking:board", "cycles:manage"],
  scheduler: ["registry:read", "sketch:use", "nights:build"],
  admin: ["registry:read", "registry:edit", "sketch:use", "mailbox:all", "users:manage"],
};

/** What a person with `roles` may do; `signedIn` adds what every signed-in person may do. */
export function permissionsFor(roles: readonly Role[], options: { signedIn?: boolean } = {}): Set<Permission> {
  const out = new Set<Permission>(PUBLIC_PERMISSIONS);
  if (options.signedIn) for (const p of SIGNED_IN_PERMISSIONS) out.add(p);
  for (const role of roles) for (const p of ROLE_PERMISSIONS[role]) out.add(p);
  return out;
}

/**
 * What a personal API token may be allowed to do, chosen when it is made. A token never opens a
 * page (account, tokens, people or any other): only the JSON API, within its scopes and the roles
 * of its owner.
 */
export const TOKEN_SCOPES = ["computations:read", "proposals:read", "proposals:write"] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];

export const TOKEN_SCOPE_LABELS: Record<TokenScope, string> = {
  "computations:read": "Run computations (coverage, ephemeris, triangles)",
  "proposals:read": "Read your own proposals",
  "proposals:write": "Change your own proposals",
};

/** Token lifetimes offered, days; the default is stated where tokens are made. */
export const TOKEN_LIFETIMES_DAYS = [7, 30, 90, 180, 365] as const;
export const DEFAULT_TOKEN_LIFETIME_DAYS = 90;

export function can(roles: readonly Role[], permission: Permission): boolean {
  return permissionsFor(roles).has(permission);
}

export type Section = {
  label: string;
  to: string;
  permission: Permission;
  /** One line for the home page and menus. */
  summary: string;
};

/**
 * The product's sections in menu order. A section is listed here once its pages exist; menus filter
 * it by permission.
 */
export const SECTIONS: readonly Section[] = [
  {
    label: "Sketchpad",
    to: href("/sketchpad"),
    permission: "sketch:use",
    summary: "uv coverage, elevation, dirty beam, visibilities and closure phases of a target, live as you type.",
  },
  {
    label: "Triangle finder",
    to: href("/triangles"),
    permission: "sketch:use",
    summary: "Station triangles ranked by the closure-phase signal of your model, uv spread and hours.",
  },
  {
    label: "Calibrators",
    to: href("/catalogue/calibrators"),
    permission: "sketch:use",
    summary: "Catalogue stars near a target that would calibrate it, ranked, with estimated diameters and why.",
  },
  {
    label: "Array registry",
    to: href("/registry"),
    permission: "registry:read",
    summary: "The site, its stations, the configurations on offer and the instruments with their bands.",
  },
  {
    label: "My targets",
    to: href("/targets"),
    permission: "proposals:own",
    summary: "Your target list with coordinates, models and magnitudes; CSV import and export.",
  },
  {
    label: "Proposals",
    to: href("/proposals"),
    permission: "proposals:own",
    summary:
      "Your proposals: text, team, targets with constraints, the PDF science case, a feasibility report, and submission.",
  },
  {
    label: "Review desk",
    to: href("/review"),
    permission: "review:desk",
    summary: "Your assignments with their due dates, conflicts to declare, and each proposal to read and score.",
  },
  {
    label: "Ranking board",
    to: href("/board"),
    permission: "ranking:board",
    summary: "Scores, normalized ranking, demand and LST pressure, suggested allocation, decisions sent to the teams.",
  },
  {
    label: "Cycles",
    to: href("/cycles"),
    permission: "cycles:read",
    summary: "Observing cycles: dates, deadline and the configurations on offer with their nights.",
  },
  {
    label: "Night builder",
    to: href("/nights"),
    permission: "nights:build",
    summary: "The cycle's nights: configurations installed, night plans built, exported, published and marked.",
  },
  {
    label: "Mailbox",
    to: href("/mailbox"),
    permission: "mailbox:own",
    summary: "The notices the app has sent you or is about to send (administrators see everyone's).",
  },
  {
    label: "People",
    to: href("/admin/users"),
    permission: "users:manage",
    summary: "Accounts, their roles and the audit log of changes.",
  },
];

/** The sections a person sees (the same for the demo and for a real installation). */
export function sectionsFor(roles: readonly Role[], options: { signedIn?: boolean } = {}): Section[] {
  const granted = permissionsFor(roles, { signedIn: options.signedIn });
  return SECTIONS.filter((s) => granted.has(s.permission));
}
