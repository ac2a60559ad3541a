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
  "cycles:manage",
  "nights:build",
  "mailbox:read",
  "users:manage",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

/** Permissions anybody has, signed in or not. */
export const PUBLIC_PERMISSIONS: readonly Permission[] = ["registry:read"];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  proposer: ["registry:read", "sketch:use", "proposals:own"],
  reviewer: ["registry:read", "sketch:use", "review:desk"],
  chair: ["registry:read", "sketch:use", "review:desk", "ranking:board", "cycles:manage"],
  scheduler: ["registry:read", "sketch:use", "nights:build"],
  admin: ["registry:read", "registry:edit", "sketch:use", "mailbox:read", "users:manage"],
};

export function permissionsFor(roles: readonly Role[]): Set<Permission> {
  const out = new Set<Permission>(PUBLIC_PERMISSIONS);
  for (const role of roles) for (const p of ROLE_PERMISSIONS[role]) out.add(p);
  return out;
}

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
    permission: "cycles:manage",
    summary: "Observing cycles: dates, deadline and the configurations on offer with their nights.",
  },
  {
    label: "Mailbox",
    to: href("/mailbox"),
    permission: "mailbox:read",
    summary: "Every notice the app has sent or is about to send, as the recipients see it.",
  },
  {
    label: "People",
    to: href("/admin/users"),
    permission: "users:manage",
    summary: "Accounts, their roles and the audit log of changes.",
  },
];

/**
 * The sections a person sees. In demo mode every signed-in person may read the mailbox, so the
 * demo's e-mails can be followed without a real inbox.
 */
export function sectionsFor(
  roles: readonly Role[],
  options: { signedIn?: boolean; demoMode?: boolean } = {},
): Section[] {
  const granted = permissionsFor(roles);
  if (options.signedIn && options.demoMode) granted.add("mailbox:read");
  return SECTIONS.filter((s) => granted.has(s.permission));
}
