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
  it("shows People only to administrators and the mailbox to admins or, in demo mode, to everyone signed in", () => {
    const labels = (roles: Parameters<typeof sectionsFor>[0], o?: Parameters<typeof sectionsFor>[1]) =>
      sectionsFor(roles, o).map((s) => s.label);
    expect(labels(["admin"])).toContain("People");
    expect(labels(["chair"])).not.toContain("People");
    expect(labels(["proposer"], { signedIn: true, demoMode: false })).not.toContain("Mailbox");
    expect(labels(["proposer"], { signedIn: true, demoMode: true })).toContain("Mailbox");
    expect(labels([], { signedIn: false, demoMode: true })).not.toContain("Mailbox");
  });
});
