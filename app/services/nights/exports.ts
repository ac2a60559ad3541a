/**
 * A night plan written out (pure): CSV through lib/csv (one row per block, units in the column names),
 * JSON as NightPlanExportSchema describes it, and iCalendar (RFC 5545, through the `ics` package) with
 * one event per block in UTC, its target and program in the description.
 */
import { createEvents, type EventAttributes } from "ics";
import { toCsv } from "~/lib/csv";
import type { ExportBlock, ExportFormat, NightPlanExport } from "./schemas";

export const CSV_FIELDS = [
  "position",
  "kind",
  "target",
  "object",
  "proposalId",
  "program",
  "pi",
  "startUtc",
  "endUtc",
  "startLstH",
  "hourAngleStartH",
  "hourAngleEndH",
  "elevationStartDeg",
  "elevationEndDeg",
  "airmassStart",
  "airmassEnd",
  "moonSeparationDeg",
  "outcome",
  "note",
  "warnings",
] as const;

/** The plan as CSV text: a header of CSV_FIELDS and one row per block. */
export function planCsv(plan: NightPlanExport): string {
  return toCsv(
    CSV_FIELDS,
    plan.blocks.map((b) => [
      b.position,
      b.kind,
      b.target,
      b.object,
      b.program?.proposalId ?? null,
      b.program?.title ?? null,
      b.program?.pi ?? null,
      b.startUtc,
      b.endUtc,
      b.startLstH,
      b.hourAngleStartH,
      b.hourAngleEndH,
      b.elevationStartDeg,
      b.elevationEndDeg,
      b.airmassStart,
      b.airmassEnd,
      b.moonSeparationDeg,
      b.outcome,
      b.note,
      b.violations.map((x) => x.reason).join("; "),
    ]),
  );
}

/** Event title of a block: "Science: T1" or "Calibrator K1 for T1". */
export function blockTitle(b: Pick<ExportBlock, "kind" | "object" | "target">): string {
  return b.kind === "science" ? `Science: ${b.target}` : `Calibrator ${b.object} for ${b.target}`;
}

function description(plan: NightPlanExport, b: ExportBlock): string {
  const lines = [
    `Target: ${b.target}`,
    `Pointing at: ${b.object} (${b.kind})`,
    b.program ? `Program: ${b.program.title} (proposal ${b.program.proposalId}, PI ${b.program.pi})` : "Program: —",
    `UT: ${b.startUtc} – ${b.endUtc}`,
    b.startLstH === null ? null : `LST at start: ${b.startLstH.toFixed(3)} h`,
    b.elevationStartDeg === null ? null : `Elevation: ${b.elevationStartDeg}° → ${b.elevationEndDeg}°`,
    `Configuration: ${plan.night.configuration}`,
    b.outcome === "planned" ? null : `Outcome: ${b.outcome}${b.note ? ` (${b.note})` : ""}`,
    plan.caution,
  ];
  return lines.filter((l): l is string => l !== null).join("\n");
}

/**
 * The plan as an iCalendar file. Times are whole seconds in the plan; iCalendar events here carry
 * minutes, so each event is written with its exact start and its length in seconds.
 */
export function planIcs(plan: NightPlanExport, options: { uidDomain?: string } = {}): string {
  const domain = options.uidDomain ?? "fringe-docket";
  const events: EventAttributes[] = plan.blocks.map((b) => {
    const startMs = Date.parse(b.startUtc);
    const seconds = Math.round((Date.parse(b.endUtc) - startMs) / 1000);
    return {
      uid: `night-${plan.night.date}-block-${b.position}-${b.kind}-${b.object.replace(/[^A-Za-z0-9]+/g, "-")}@${domain}`,
      start: startMs,
      startInputType: "utc",
      startOutputType: "utc",
      duration: {
        hours: Math.floor(seconds / 3600),
        minutes: Math.floor((seconds % 3600) / 60),
        seconds: seconds % 60,
      },
      title: blockTitle(b),
      description: description(plan, b),
      location: plan.night.site.name,
      geo: { lat: plan.night.site.latitudeDeg, lon: plan.night.site.longitudeDeg },
      categories: [b.kind, b.outcome],
      status: b.outcome === "planned" || b.outcome === "executed" ? "CONFIRMED" : "CANCELLED",
      calName: `Night plan ${plan.night.date}`,
    };
  });
  if (events.length === 0) {
    return [
      "BEGIN:VCALENDAR",
      "VERSION:2.0",
      "PRODID:-//fringe-docket//night plan//EN",
      "CALSCALE:GREGORIAN",
      `X-WR-CALNAME:Night plan ${plan.night.date}`,
      "END:VCALENDAR",
      "",
    ].join("\r\n");
  }
  const { error, value } = createEvents(events, {
    productId: "fringe-docket//night plan",
    calName: `Night plan ${plan.night.date}`,
  });
  if (error || !value) throw error ?? new Error("iCalendar: nothing written");
  return value;
}

/** The plan as a downloadable file of one of the export formats. */
export function planFile(
  plan: NightPlanExport,
  format: ExportFormat,
): { body: string; contentType: string; filename: string } {
  const filename = `night-plan-${plan.night.date}${plan.filtered ? "-mine" : ""}.${format}`;
  if (format === "csv") return { body: planCsv(plan), contentType: "text/csv; charset=utf-8", filename };
  if (format === "ics") return { body: planIcs(plan), contentType: "text/calendar; charset=utf-8", filename };
  return { body: `${JSON.stringify(plan, null, 2)}\n`, contentType: "application/json; charset=utf-8", filename };
}
