/** The plan request's wire schema: defaults, one-line errors naming the field, cross-field rules. */
import { describe, expect, it } from "vitest";
import { PLAN_DEFAULTS, parsePlanRequest } from "~/engine";
import { SITE, STATIONS, target } from "./fixtures";

const base = { site: SITE, date: "2027-03-15", stations: STATIONS, targets: [target("T1", 84.05, -1.2)] };
const fail = (extra: Record<string, unknown>) => {
  const r = parsePlanRequest({ ...base, ...extra });
  return r.ok ? "ok" : r.message;
};

describe("parsePlanRequest", () => {
  it("fills the documented defaults", () => {
    const r = parsePlanRequest({
      site: SITE,
      date: "2027-03-15",
      targets: [{ name: "T", raDeg: 1, decDeg: 2, priority: 1, hoursOwed: 1 }],
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value).toMatchObject({
      stations: [],
      delayLineStrokeM: null,
      minElevationDeg: 30,
      moonMinSeparationDeg: 10,
      sunMinSeparationDeg: 45,
      scienceBlockMin: 40,
      calibratorBlockMin: 15,
      notBeforeUtc: null,
      executedBlocks: [],
    });
    expect(r.value.targets[0]).toMatchObject({ minElevationDeg: null, calibrators: [] });
    expect(PLAN_DEFAULTS.sunMinSeparationDeg).toBe(45);
  });

  it("accepts the contract's example", () => {
    expect(
      fail({
        stations: [{ name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 }, STATIONS[1]],
        delayLineStrokeM: 90,
        minElevationDeg: 30,
        moonMinSeparationDeg: 10,
        scienceBlockMin: 40,
        calibratorBlockMin: 15,
      }),
    ).toBe("ok");
  });

  it("names the failing field", () => {
    expect(fail({ targets: [{ ...target("T1", 84.05, -1.2), decDeg: 95 }] })).toBe(
      "targets[0].decDeg: must be between -90 and 90",
    );
    expect(fail({ date: "2027-02-30" })).toBe("date: must be a real calendar date");
    expect(fail({ site: undefined })).toBe("site: is required");
    expect(fail({ targets: [{ ...target("T1", 84.05, -1.2), hoursOwed: -1 }] })).toBe(
      "targets[0].hoursOwed: must be between 0 and 10000",
    );
    expect(fail({ targets: [{ ...target("T1", 84.05, -1.2), priority: undefined }] })).toBe(
      "targets[0].priority: is required",
    );
    expect(fail({ scienceBlockMin: 0 })).toBe("scienceBlockMin: must be between 1 and 720");
    expect(fail({ notBeforeUtc: "tonight" })).toBe(
      "notBeforeUtc: must be an ISO-8601 instant such as 2027-03-16T01:30:00Z",
    );
    expect(fail({ targets: [{ ...target("T1", 1, 2), calibrators: [{ name: "K", raDeg: 400, decDeg: 0 }] }] })).toBe(
      "targets[0].calibrators[0].raDeg: must be between 0 and 360",
    );
  });

  it("checks names and executed blocks across fields", () => {
    expect(fail({ targets: [target("A", 1, 2), target("A", 3, 4)] })).toBe(
      'targets[1].name: "A" appears more than once',
    );
    expect(fail({ targets: [{ ...target("A", 1, 2), calibrators: [{ name: "A", raDeg: 1, decDeg: 2 }] }] })).toBe(
      "targets[0].calibrators[0].name: must differ from the target's name",
    );
    expect(fail({ delayLineStrokeM: 90, stations: [STATIONS[0]] })).toBe(
      "stations: needs at least 2 stations to check the delay-line stroke",
    );
    const block = {
      kind: "calibrator",
      target: "T1",
      object: "X",
      startUtc: "2027-03-16T01:00:00Z",
      endUtc: "2027-03-16T01:15:00Z",
    };
    expect(fail({ executedBlocks: [block] })).toBe('executedBlocks[0].object: "X" is not a calibrator of T1');
    expect(fail({ executedBlocks: [{ ...block, target: "Q" }] })).toBe(
      'executedBlocks[0].target: "Q" is not among the targets',
    );
    expect(fail({ executedBlocks: [{ ...block, object: "T1-K", endUtc: block.startUtc }] })).toBe(
      "executedBlocks[0].endUtc: must be after startUtc",
    );
    expect(fail({ executedBlocks: [{ ...block, object: "T1-K" }] })).toBe("ok");
  });

  it("refuses a body that is not an object", () => {
    expect(parsePlanRequest([])).toEqual({ ok: false, message: "request must be a JSON object", field: null });
  });
});
