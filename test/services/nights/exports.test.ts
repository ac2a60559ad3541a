import { nightSettings } from "@test/nights";
import ICAL from "ical.js";
import Papa from "papaparse";
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { computePlan, PLAN_SAFETY_WARNING, parsePlanRequest } from "~/engine";
import { CSV_FIELDS, planCsv, planFile, planIcs } from "~/services/nights/exports";
import { type NightPlanExport, NightPlanExportSchema } from "~/services/nights/schemas";
import { fixtureTargets } from "./fixture";

// A real plan from the engine for the fixture's targets (three stations placed like the demo's), written out
// the way the night's export writes it; every format is then read back by an independent parser.
const NIGHT = "2025-05-20";
const site = { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 };
const t = fixtureTargets(NIGHT);
const request = parsePlanRequest({
  site,
  date: NIGHT,
  stations: [
    { name: "C01", eastM: -16, northM: -27.713, upM: 0, pathOffsetM: 0 },
    { name: "C10", eastM: 16, northM: 0, upM: 0.2, pathOffsetM: 1.2 },
    { name: "X01", eastM: 32.161, northM: 105.193, upM: 1.2, pathOffsetM: 14.5 },
  ],
  delayLineStrokeM: 90,
  targets: [...t.first, ...t.second].map((x, i) => ({ ...x, priority: i < 3 ? 1 : 2, hoursOwed: 1 })),
});
if (!request.ok) throw new Error(request.message);
const result = computePlan(request.value);
const TITLE = 'Winds, "quoted"; and more';

const plan: NightPlanExport = {
  night: {
    date: NIGHT,
    site: { name: "Sierra Lumbre Array", ...site },
    configuration: "test-3",
    stations: ["C01", "C10", "X01"],
    state: "published",
    astronomicalDuskUtc: result.night.astronomicalDuskUtc,
    astronomicalDawnUtc: result.night.astronomicalDawnUtc,
    moonIlluminatedFraction: result.night.moonIlluminatedFraction,
  },
  settings: nightSettings({ delayLineStrokeM: 90 }),
  filtered: false,
  blocks: result.blocks.map((b, i) => ({
    position: i + 1,
    kind: b.kind,
    target: b.target,
    object: b.object,
    program: {
      proposalId: b.target.startsWith("Zorzal") ? 8 : 7,
      title: b.target.startsWith("Zorzal") ? "The pair" : TITLE,
      pi: "Noor Quillay",
    },
    startUtc: b.startUtc,
    endUtc: b.endUtc,
    startLstH: b.startLstH,
    hourAngleStartH: b.hourAngleStartH,
    hourAngleEndH: b.hourAngleEndH,
    elevationStartDeg: b.elevationStartDeg,
    elevationEndDeg: b.elevationEndDeg,
    airmassStart: b.airmassStart,
    airmassEnd: b.airmassEnd,
    moonSeparationDeg: b.moonSeparationDeg,
    outcome: i === 1 ? "executed" : "planned",
    note: i === 1 ? 'seeing 0.7", ok' : "",
    violations: [],
  })),
  caution: PLAN_SAFETY_WARNING,
  generatedUtc: "2025-05-20T12:00:00Z",
};

describe("night plan exports read back", () => {
  it("has a plan to export", () => {
    expect(plan.blocks.length).toBeGreaterThanOrEqual(9);
  });

  it("CSV: papaparse reads every block back with its fields and units in the header", () => {
    const parsed = Papa.parse<Record<string, string>>(planCsv(plan), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...CSV_FIELDS]);
    expect(parsed.data).toHaveLength(plan.blocks.length);
    parsed.data.forEach((row, i) => {
      const b = plan.blocks[i];
      expect(row.kind).toBe(b.kind);
      expect(row.object).toBe(b.object);
      expect(row.program).toBe(b.program?.title);
      expect(row.startUtc).toBe(b.startUtc);
      expect(Number(row.startLstH)).toBe(b.startLstH);
      expect(Number(row.elevationEndDeg)).toBe(b.elevationEndDeg);
      expect(row.note).toBe(b.note);
    });
  });

  it("iCalendar: ical.js finds one UTC event per block, its target and program in the description", () => {
    const calendar = new ICAL.Component(ICAL.parse(planIcs(plan)));
    const events = calendar.getAllSubcomponents("vevent").map((c) => new ICAL.Event(c));
    expect(events).toHaveLength(plan.blocks.length);
    events.forEach((e, i) => {
      const b = plan.blocks[i];
      expect(e.startDate.toJSDate().toISOString().replace(".000Z", "Z")).toBe(b.startUtc);
      expect(e.endDate.toJSDate().toISOString().replace(".000Z", "Z")).toBe(b.endUtc);
      expect(e.startDate.zone?.tzid).toBe("UTC");
      expect(e.summary).toBe(b.kind === "science" ? `Science: ${b.target}` : `Calibrator ${b.object} for ${b.target}`);
      expect(e.description).toContain(`Target: ${b.target}`);
      expect(e.description).toContain(`Program: ${b.program?.title}`);
      expect(e.uid).toMatch(/@fringe-docket$/);
    });
    expect(new Set(events.map((e) => e.uid)).size).toBe(events.length);
  });

  it("iCalendar of a plan without blocks is still a calendar", () => {
    const empty = new ICAL.Component(ICAL.parse(planIcs({ ...plan, blocks: [] })));
    expect(empty.name).toBe("vcalendar");
    expect(empty.getAllSubcomponents("vevent")).toHaveLength(0);
  });

  it("JSON: the file parses against NightPlanExportSchema, and a wrong kind does not", () => {
    const file = planFile(plan, "json");
    expect(file.contentType).toMatch(/^application\/json/);
    const json = JSON.parse(file.body);
    expect(v.safeParse(NightPlanExportSchema, json).success).toBe(true);
    json.blocks[0].kind = "flat";
    expect(v.safeParse(NightPlanExportSchema, json).success).toBe(false);
    expect(planFile({ ...plan, filtered: true }, "ics").filename).toBe("night-plan-2025-05-20-mine.ics");
  });
});
