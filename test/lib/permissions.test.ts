import { describe, expect, it } from "vitest";
import { ROLES } from "~/db/schema/users";
import { can, permissionsFor, ROLE_PERMISSIONS, sectionsFor } from "~/lib/permissions";

describe("permissions", () => {
  it("covers every role", () => {
    expect(Object.keys(ROLE_PERMISSIONS).sort()).toEqual([...ROLES].sort());
  });

  it("lets anybody read the registry but only admins edit it", () => {
    expect(can([], "registry:read")).toBe(true);
    expect(can([], "registry:edit")).toBe(false);
    expect(can(["proposer", "chair"], "registry:edit")).toBe(false);
    expect(can(["admin"], "registry:edit")).toBe(true);
  });

  it("unions the permissions of several roles", () => {
    const p = permissionsFor(["reviewer", "scheduler"]);
    expect(p.has("review:desk")).toBe(true);
    expect(p.has("nights:build")).toBe(true);
    expect(p.has("ranking:board")).toBe(false);
  });

  it("shows anonymous visitors only public sections", () => {
    expect(sectionsFor([]).every((s) => s.permission === "registry:read")).toBe(true);
  });
});

describe("sections by role", () => {
  it("shows People only to administrators, and everyone signed in their own mailbox", () => {
    const labels = (roles: Parameters<typeof sectionsFor>[0], o?: Parameters<typeof sectionsFor>[1]) =>
      sectionsFor(roles, o).map((s) => s.label);
    expect(labels(["admin"], { signedIn: true })).toContain("People");
    expect(labels(["chair"], { signedIn: true })).not.toContain("People");
    expect(labels(["proposer"], { signedIn: true })).toContain("Mailbox");
    expect(labels([], { signedIn: false })).not.toContain("Mailbox");
  });

  it("shows Cycles to every role that may open the list, and lets only the chair manage them", () => {
    const labels = (role: Parameters<typeof sectionsFor>[0][number]) =>
      sectionsFor([role], { signedIn: true }).map((s) => s.label);
    for (const role of ["proposer", "reviewer", "chair", "scheduler", "admin"] as const) {
      expect(labels(role), role).toContain("Cycles");
      expect(permissionsFor([role], { signedIn: true }).has("cycles:manage"), role).toBe(role === "chair");
    }
    expect(sectionsFor([], { signedIn: false }).map((s) => s.label)).not.toContain("Cycles");
  });

  it("lets only administrators read everybody's mail; the demo mode is not a permission", () => {
    expect(permissionsFor(["proposer"], { signedIn: true }).has("mailbox:own")).toBe(true);
    for (const role of ["proposer", "reviewer", "chair", "scheduler"] as const)
      expect(permissionsFor([role], { signedIn: true }).has("mailbox:all"), role).toBe(false);
    expect(permissionsFor(["admin"], { signedIn: true }).has("mailbox:all")).toBe(true);
    expect(permissionsFor([]).has("mailbox:own")).toBe(false);
  });
});
