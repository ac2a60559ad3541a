/**
 * The catalogue's JSON API through its route modules, with a proposer's API token: POST /api/resolve by
 * every naming form, POST /api/calibrators and its invariants checked by methods written here (haversine
 * distance, the Bessel integral, sidereal time from astronomia), GET /api/stars for the name field, and
 * the refusals a client's mistakes get.
 */
import { besselIntegral } from "@test/bessel";
import { routeArgs, settle, testDb } from "@test/routes";
import { mean as meanSiderealSeconds } from "astronomia/sidereal";
import { beforeAll, describe, expect, it } from "vitest";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { action as calibratorsAction } from "~/routes/api/calibrators";
import { action as resolveAction, loader as resolveLoader } from "~/routes/api/resolve";
import { loader as starsLoader } from "~/routes/api/stars";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createApiToken } from "~/services/auth/api-tokens.server";

let bearer = "";
beforeAll(async () => {
  await seedDemoScenario(testDb());
  const user = await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example");
  bearer = `Bearer ${(await createApiToken(testDb(), user!.id, "catalogue tests")).token}`;
});

async function call(fn: (args: never) => unknown, path: string, body?: unknown, auth = true) {
  const init: RequestInit = body === undefined ? {} : { method: "POST", body: JSON.stringify(body) };
  const headers: Record<string, string> = { "Content-Type": "application/json" };
  if (auth) headers.Authorization = bearer;
  const res = await settle(() => fn(routeArgs(path, { ...init, headers })));
  return { status: res.status, json: await res.json() };
}

const resolve = (name: unknown) => call(resolveAction, "/api/resolve", { name });

const SITE = { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 };
const REQUEST = {
  target: { name: "Betelgeuse" },
  wavelengthM: 1.65e-6,
  longestBaselineM: 160,
  site: SITE,
  date: "2027-01-10",
  minElevationDeg: 30,
  maxDistanceDeg: 10,
  minVis2: 0.8,
  limit: 20,
};

describe("POST /api/resolve", () => {
  // starnames.json, HIP 27989: proper name Betelgeuse, Bayer α, Flamsteed 58, constellation Orion, HD 39801.
  it.each([
    ["HD 39801", "catalogue number"],
    ["HIP 27989", "catalogue number"],
    ["hip27989", "catalogue number"],
    ["alf Ori", "designation"],
    ["α Ori", "designation"],
    ["Alpha Orionis", "designation"],
    ["58 Ori", "designation"],
    ["58 Orionis", "designation"],
    ["Betelgeuse", "name"],
    ["  BETELGEUSE ", "name"],
    ["Betelgeuze", "typo"],
  ])("%s names Betelgeuse (%s)", async (name, matchedBy) => {
    const { status, json } = await resolve(name);
    expect(status).toBe(200);
    expect(json).toMatchObject({ name: "Betelgeuse", hip: 27989, hd: 39801, vMag: 0.45, bv: 1.5, matchedBy });
    expect(json.designations).toEqual(["Betelgeuse", "α Ori", "58 Ori", "HD 39801", "HIP 27989"]);
    // stars.8.json gives HIP 27989 at [88.7929, 7.4071] (J2000 degrees).
    expect(json.raDeg).toBeCloseTo(88.7929, 4);
    expect(json.decDeg).toBeCloseTo(7.4071, 4);
  });

  it("answers the contract's fields and nothing the contract does not list but matchedBy and alsoNamed", async () => {
    const { json } = await resolve("HD 39801");
    expect(Object.keys(json).sort()).toEqual(
      ["alsoNamed", "bv", "decDeg", "designations", "hd", "hip", "matchedBy", "name", "raDeg", "vMag"].sort(),
    );
  });

  it("finds a variable-star designation and a Latin-letter Bayer one", async () => {
    // starnames.json: CG And is HIP 116584's variable designation; "c Psc" and "A Car" are Latin-letter Bayer forms.
    const variable = await resolve("CG And");
    expect(variable.status).toBe(200);
    expect(variable.json.designations).toContain("CG And");
    const latin = await resolve("A Car");
    expect(latin.status).toBe(200);
    expect(latin.json.designations).toContain("A Car");
  });

  it("refuses an unknown name with 400 naming the field, and offers near names", async () => {
    const near = await resolve("Betelgoosey");
    expect(near.status).toBe(400);
    expect(near.json).toEqual({
      error: 'name: no star called "Betelgoosey" (did you mean Betelgeuse?)',
      field: "name",
    });
    const none = await resolve("HD 39802");
    expect(none.json.error).toMatch(/^name: no star called "HD 39802"/);
  });

  it("refuses a missing, empty, too long or non-string name, and bad JSON, with 400", async () => {
    for (const name of ["", "   ", "x".repeat(101), 42, null]) {
      const r = await resolve(name);
      expect(r.status).toBe(400);
      expect(r.json.field).toBe("name");
    }
    const res = await settle(() =>
      resolveAction(
        routeArgs("/api/resolve", {
          method: "POST",
          body: "{nope",
          headers: { Authorization: bearer, "Content-Type": "application/json" },
        }),
      ),
    );
    expect(res.status).toBe(400);
  });

  it("answers 401 without a session or token, and 405 to a GET", async () => {
    expect((await call(resolveAction, "/api/resolve", { name: "Vega" }, false)).status).toBe(401);
    expect((await call(resolveLoader, "/api/resolve")).status).toBe(405);
  });
});

/** Great-circle distance in degrees (haversine), written here independently of the engine. */
function haversineDeg(ra1: number, dec1: number, ra2: number, dec2: number): number {
  const r = Math.PI / 180;
  const h =
    Math.sin(((dec2 - dec1) * r) / 2) ** 2 +
    Math.cos(dec1 * r) * Math.cos(dec2 * r) * Math.sin(((ra2 - ra1) * r) / 2) ** 2;
  return (2 * Math.asin(Math.sqrt(h))) / r;
}

/** Uniform-disk V² = [2 J1(x)/x]², x = π θ B/λ, with J1 from its integral (test/support/bessel.ts). */
function uniformDiskVis2(diameterMas: number, baselineM: number, wavelengthM: number): number {
  const x = (Math.PI * diameterMas * Math.PI * baselineM) / (180 * 3600 * 1000 * wavelengthM);
  return ((2 * besselIntegral(1, x)) / x) ** 2;
}

/** Elevation (degrees) of a J2000 position at a Julian day, from astronomia's mean sidereal time. */
function elevationDeg(jd: number, raDeg: number, decDeg: number): number {
  const r = Math.PI / 180;
  const lstDeg = (meanSiderealSeconds(jd) / 240 + SITE.longitudeDeg + 360) % 360;
  const ha = (lstDeg - raDeg) * r;
  const lat = SITE.latitudeDeg * r;
  return Math.asin(Math.sin(lat) * Math.sin(decDeg * r) + Math.cos(lat) * Math.cos(decDeg * r) * Math.cos(ha)) / r;
}

const jdOf = (iso: string) => Date.parse(iso) / 86_400_000 + 2440587.5;

describe("POST /api/calibrators", () => {
  it("lists stars within the radius, nearly unresolved, up with the target, best first, never the target", async () => {
    const { status, json } = await call(calibratorsAction, "/api/calibrators", REQUEST);
    expect(status).toBe(200);
    const { target, calibrators, night } = json;
    expect(target).toMatchObject({ name: "Betelgeuse", hip: 27989 });
    expect(calibrators.length).toBeGreaterThan(5);
    expect(calibrators.length).toBeLessThanOrEqual(REQUEST.limit);
    const dusk = jdOf(night.astronomicalDuskUtc);
    const dawn = jdOf(night.astronomicalDawnUtc);
    for (const c of calibrators) {
      expect(c.hip).not.toBe(27989);
      expect(haversineDeg(target.raDeg, target.decDeg, c.raDeg, c.decDeg)).toBeLessThanOrEqual(10 + 1e-6);
      expect(c.distanceDeg).toBeCloseTo(haversineDeg(target.raDeg, target.decDeg, c.raDeg, c.decDeg), 2);
      expect(c.vis2).toBeGreaterThanOrEqual(REQUEST.minVis2);
      // The engine's V² of the estimated diameter, against the Bessel integral: 4 decimals as returned.
      expect(c.vis2).toBeCloseTo(uniformDiskVis2(c.diameterMas, 160, 1.65e-6), 3);
      expect(c.observableHours).toBeGreaterThan(0);
      expect(c.observableHours).toBeLessThanOrEqual(target.observableHours);
      // Some 10-minute sample of the dark hours has both above the limit (0.5° margin: no precession here).
      let together = false;
      for (let jd = dusk; jd <= dawn && !together; jd += 10 / 1440) {
        together = elevationDeg(jd, target.raDeg, target.decDeg) >= 29.5 && elevationDeg(jd, c.raDeg, c.decDeg) >= 29.5;
      }
      expect(together).toBe(true);
      expect(c.reasons.some((r: string) => r.includes("estimate"))).toBe(true);
    }
    const scores = calibrators.map((c: { score: number }) => c.score);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
  });

  it("gives the same list for the target by name and by its catalogue position", async () => {
    const byName = await call(calibratorsAction, "/api/calibrators", REQUEST);
    const byPosition = await call(calibratorsAction, "/api/calibrators", {
      ...REQUEST,
      target: { raDeg: 88.7929, decDeg: 7.4071 },
    });
    expect(byPosition.json.calibrators.map((c: { hip: number }) => c.hip)).toEqual(
      byName.json.calibrators.map((c: { hip: number }) => c.hip),
    );
  });

  it("keeps only stars as unresolved as asked: a stricter V² limit gives a subset", async () => {
    const loose = await call(calibratorsAction, "/api/calibrators", { ...REQUEST, minVis2: 0.5, limit: 500 });
    const strict = await call(calibratorsAction, "/api/calibrators", { ...REQUEST, minVis2: 0.95, limit: 500 });
    const looseHips = new Set(loose.json.calibrators.map((c: { hip: number }) => c.hip));
    expect(strict.json.calibrators.length).toBeLessThan(loose.json.calibrators.length);
    for (const c of strict.json.calibrators) {
      expect(c.vis2).toBeGreaterThanOrEqual(0.95);
      expect(looseHips.has(c.hip)).toBe(true);
    }
  });

  it.each([
    [{ ...REQUEST, target: { name: "Zorgon Prime" } }, "target.name", /^target\.name: no star called "Zorgon Prime"/],
    [{ ...REQUEST, wavelengthM: -1 }, "wavelengthM", /^wavelengthM: must be positive/],
    [{ ...REQUEST, maxDistanceDeg: 100 }, "maxDistanceDeg", /^maxDistanceDeg: must be at most 90/],
    [{ ...REQUEST, minVis2: 2 }, "minVis2", /^minVis2: must be between 0 and 1/],
    [{ ...REQUEST, date: "2027-02-30" }, "date", /^date: /],
    [{ ...REQUEST, target: { name: "Vega", raDeg: 1, decDeg: 2 } }, "target", /^target: give either a name/],
    [{ ...REQUEST, limit: 0 }, "limit", /^limit: must be at least 1/],
  ])("refuses %j with 400 naming %s", async (body, field, message) => {
    const { status, json } = await call(calibratorsAction, "/api/calibrators", body);
    expect(status).toBe(400);
    expect(json.field).toBe(field);
    expect(json.error).toMatch(message);
  });
});

describe("GET /api/stars", () => {
  const stars = (q: string) => call(starsLoader, `/api/stars?${q}`);

  it("offers names that begin with the text, brightest first, and resolves a full name", async () => {
    const partial = await stars("q=betel");
    expect(partial.status).toBe(200);
    expect(partial.json.star).toBeNull();
    expect(partial.json.suggestions[0]).toMatchObject({ hip: 27989, name: "Betelgeuse", also: "α Ori" });
    // Half a name is neither read as a typo of another star (Belel) nor called unknown.
    const sir = await stars("q=sir");
    expect(sir.json).toMatchObject({ star: null, message: null });
    expect(sir.json.suggestions.map((x: { name: string }) => x.name)).toContain("Sirius");
    const full = await stars(`q=${encodeURIComponent("alf Ori")}`);
    expect(full.json.star).toMatchObject({ hip: 27989, matchedBy: "designation" });
    expect(full.json.message).toBeNull();
  });

  it("says why a name names no star, and answers an empty text with nothing", async () => {
    const unknown = await stars(`q=${encodeURIComponent("Lumbre Nova 12")}`);
    expect(unknown.status).toBe(200);
    expect(unknown.json.star).toBeNull();
    expect(unknown.json.message).toMatch(/^no star called "Lumbre Nova 12"/);
    const empty = await stars("q=");
    expect(empty.json).toEqual({ query: "", star: null, message: null, suggestions: [] });
  });

  it("refuses a text over 100 characters and a bad limit with 400 naming the field", async () => {
    const long = await stars(`q=${"x".repeat(101)}`);
    expect(long.status).toBe(400);
    expect(long.json.field).toBe("q");
    const limit = await stars("q=vega&limit=0");
    expect(limit.status).toBe(400);
    expect(limit.json.field).toBe("limit");
    expect((await call(starsLoader, "/api/stars?q=vega", undefined, false)).status).toBe(401);
  });
});
