/** Requests and people for the imaging-preview tests (invented stations of the demo site). */
import type { Database } from "~/db/client.server";
import type { Role } from "~/db/schema/users";
import { ensureUser } from "~/db/seed/factories.server";
import type { Viewer } from "~/lib/guards.server";
import { permissionsFor } from "~/lib/permissions";
import { startPreviews } from "~/services/imaging/commands.server";
import { binaryTarget, demoSite } from "./demo-array";

/** Six stations on two rings (invented), 15 baselines of 20–110 m in many directions. */
export function sixStations() {
  const out = [{ name: "S0", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 }];
  const ring = [
    [30, 10],
    [-25, 40],
    [-60, -20],
    [20, -55],
    [45, 50],
  ];
  for (const [i, [e, n]] of ring.entries())
    out.push({ name: `S${i + 1}`, eastM: e, northM: n, upM: 0, pathOffsetM: 0 });
  return out;
}

/** A Sketchpad-like coverage body: a binary near the zenith observed ±3 h in three H-band channels. */
export function imagingCoverage(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  const hourAnglesH: number[] = [];
  for (let h = -3; h <= 3.0001; h += 0.25) hourAnglesH.push(Math.round(h * 100) / 100);
  return {
    site: demoSite(),
    stations: sixStations(),
    target: binaryTarget("Test binary", { decDeg: -30, separationMas: 4, positionAngleDeg: 60 }),
    wavelengthsM: [1.6e-6, 1.65e-6, 1.7e-6],
    hourAnglesH,
    minElevationDeg: 30,
    delayLineStrokeM: null,
    ...overrides,
  };
}

/** A signed-in person with `roles`, as the guards would give them to a service. */
export async function viewerWith(db: Database, email: string, roles: Role[]): Promise<Viewer> {
  const user = await ensureUser(db, { email, name: email.split("@")[0], institute: "Test Institute", roles });
  return {
    user: { id: user.id, email: user.email, name: user.name, institute: user.institute },
    roles,
    permissions: permissionsFor(roles, { signedIn: true }),
    sessionId: "test",
    via: "session",
    scopes: null,
  };
}

/** `viewer` asks for an imaging preview of a Sketchpad coverage (the test one unless given), with `settings` if any. */
export function startSketchPreview(
  db: Database,
  viewer: Viewer,
  settings?: Record<string, unknown>,
  coverage = imagingCoverage(),
) {
  return startPreviews(db, { viewer, json: { source: { kind: "sketch", coverage }, ...(settings && { settings }) } });
}
