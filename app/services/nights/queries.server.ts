/**
 * Reading one night for its page and its exports: the sky, the candidates with their windows, the
 * stored plan validated and described block by block, and the export of the plan (whole, or only the
 * blocks of the asker's own programs).
 */
import { inArray } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { proposalMembers, proposals } from "~/db/schema/proposals";
import type { Role } from "~/db/schema/users";
import { PLAN_SAFETY_WARNING, roundTo } from "~/engine";
import { relationTo } from "~/services/proposals/access.server";
import { type Candidate, type CandidateWindow, candidateWindows, planContext, planRequest } from "./candidates";
import { loadNight } from "./night.server";
import type { ExportBlock, NightPlanExport } from "./schemas";
import { moonAltitudeCurve, type NightSkySummary, nightSkySummary } from "./sky";
import { type BlockView, type StoredBlock, viewBlocks } from "./view";

/** The date before or after `date` (YYYY-MM-DD). */
export function shiftDate(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

export type CandidateRow = Candidate & {
  window: CandidateWindow | null;
  /** Science executed this night, hours. */
  executedTonightHours: number;
  /** Owed at the start of the night less what this night executed, hours (never below 0). */
  owedNowHours: number;
};

/** Executed science of this night per proposal target, hours. */
function executedTonight(blocks: readonly StoredBlock[]): Map<number, number> {
  const out = new Map<number, number>();
  for (const b of blocks) {
    if (b.kind !== "science" || b.outcome !== "executed" || b.proposalTargetId === null) continue;
    const h = (b.endUtc.getTime() - b.startUtc.getTime()) / 3_600_000;
    out.set(b.proposalTargetId, (out.get(b.proposalTargetId) ?? 0) + h);
  }
  return out;
}

/** Everything the night page shows. */
export async function nightPage(db: DbOrTx, { date }: { date: string }) {
  const night = await loadNight(db, { date });
  const site = night.site;
  const sky: NightSkySummary | null = site
    ? nightSkySummary(
        date,
        { latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM },
        site.timeZone,
      )
    : null;
  let blocks: BlockView[] = [];
  let valid = true;
  const tonight = executedTonight(night.blocks);
  const row = (c: Candidate, window: CandidateWindow | null): CandidateRow => {
    const executedTonightHours = roundTo(tonight.get(c.proposalTargetId) ?? 0, 4);
    return {
      ...c,
      window,
      executedTonightHours,
      owedNowHours: roundTo(Math.max(0, c.owedHours - executedTonightHours), 4),
    };
  };
  let candidates: CandidateRow[] = night.candidates.map((c) => row(c, null));
  let planStartUtc: string | null = null;
  if (night.setting) {
    const input = planRequest(night.setting, night.candidates);
    const ctx = planContext(input);
    const windows = new Map(candidateWindows(ctx).map((w) => [w.key, w]));
    candidates = night.candidates.map((c) => row(c, windows.get(c.key) ?? null));
    const viewed = viewBlocks(input, ctx, night.blocks, night.candidates);
    blocks = viewed.blocks;
    valid = viewed.ok;
    planStartUtc =
      ctx.sky.darkStartSec === null ? null : new Date(ctx.sky.darkStartSec * 1000).toISOString().replace(".000Z", "Z");
  }
  const moon =
    site && sky?.sunsetUtc && sky.sunriseUtc
      ? moonAltitudeCurve(sky.sunsetUtc, sky.sunriseUtc, {
          latitudeDeg: site.latitudeDeg,
          longitudeDeg: site.longitudeDeg,
          altitudeM: site.altitudeM,
        })
      : null;
  const plan = night.plan;
  const nowMin = Math.floor(Date.now() / 60_000) * 60_000;
  const dusk = planStartUtc ? Date.parse(planStartUtc) : null;
  const dawn = sky?.astronomicalDawnUtc ? Date.parse(sky.astronomicalDawnUtc) : null;
  const from = dusk !== null && dawn !== null && nowMin > dusk && nowMin < dawn ? nowMin : (dusk ?? nowMin);
  return {
    date,
    previous: shiftDate(date, -1),
    next: shiftDate(date, 1),
    installation: night.installation,
    site: site
      ? {
          name: site.name,
          latitudeDeg: site.latitudeDeg,
          longitudeDeg: site.longitudeDeg,
          altitudeM: site.altitudeM,
          timeZone: site.timeZone,
          minElevationDeg: site.minElevationDeg,
          delayLineStrokeM: site.delayLineStrokeM,
        }
      : null,
    stationNames: night.stationNames,
    sky,
    moonCurve: moon,
    settings: night.setting?.settings ?? null,
    plan: plan
      ? { id: plan.id, state: plan.state, report: plan.report, publishedAt: plan.publishedAt?.toISOString() ?? null }
      : null,
    planStartUtc,
    /** The re-plan form's first value: now during the night, else the start of darkness ("YYYY-MM-DDTHH:MM", UTC). */
    replanFrom: new Date(from).toISOString().slice(0, 16),
    candidates,
    blocks,
    valid,
    canPublish: !!plan && plan.state === "draft" && valid && blocks.some((b) => b.outcome === "planned"),
  };
}

export type NightPageData = Awaited<ReturnType<typeof nightPage>>;

/** Who is asking for an export: the scheduler sees the whole plan, a program's team its own blocks. */
export type ExportViewer = { user: { id: number; email: string }; roles: readonly Role[]; scheduler: boolean };

/**
 * The plan of a night as exported, or null when there is nothing the viewer may see: no plan, a draft
 * for anybody but the scheduler, or no block of the viewer's programs.
 */
export async function planExport(
  db: DbOrTx,
  { date, viewer }: { date: string; viewer: ExportViewer },
): Promise<NightPlanExport | null> {
  const page = await nightPage(db, { date });
  if (!page.plan || !page.installation || !page.site || !page.settings) return null;
  if (!viewer.scheduler && page.plan.state === "draft") return null;
  const ids = [...new Set(page.blocks.map((b) => b.proposalId).filter((x): x is number => x !== null))];
  const rows = ids.length
    ? await db.query.proposals.findMany({ where: inArray(proposals.id, ids), with: { pi: true } })
    : [];
  const members = ids.length
    ? await db.select().from(proposalMembers).where(inArray(proposalMembers.proposalId, ids))
    : [];
  const program = new Map(
    rows.map((p) => [p.id, { proposalId: p.id, title: p.title || `Proposal ${p.id}`, pi: p.pi.name }]),
  );
  let blocks = page.blocks;
  if (!viewer.scheduler) {
    const mine = new Set(
      rows
        .filter((p) =>
          relationTo(viewer, { piId: p.piId, status: p.status, members: members.filter((m) => m.proposalId === p.id) }),
        )
        .map((p) => p.id),
    );
    blocks = blocks.filter((b) => b.proposalId !== null && mine.has(b.proposalId));
    if (blocks.length === 0) return null;
  }
  const sky = page.sky;
  return {
    night: {
      date,
      site: {
        name: page.site.name,
        latitudeDeg: page.site.latitudeDeg,
        longitudeDeg: page.site.longitudeDeg,
        altitudeM: page.site.altitudeM,
      },
      configuration: page.installation.configurationName,
      stations: page.stationNames,
      state: page.plan.state,
      astronomicalDuskUtc: sky?.astronomicalDuskUtc ?? null,
      astronomicalDawnUtc: sky?.astronomicalDawnUtc ?? null,
      moonIlluminatedFraction: sky?.moon.illuminatedFraction ?? 0,
    },
    settings: { ...page.settings, delayLineStrokeM: page.stationNames.length >= 2 ? page.site.delayLineStrokeM : null },
    filtered: !viewer.scheduler,
    blocks: blocks.map(
      (b, i): ExportBlock => ({
        position: viewer.scheduler ? b.position : i + 1,
        kind: b.kind,
        target: b.target,
        object: b.object,
        program: b.proposalId === null ? null : (program.get(b.proposalId) ?? null),
        startUtc: b.startUtc,
        endUtc: b.endUtc,
        startLstH: b.fields?.startLstH ?? null,
        hourAngleStartH: b.fields?.hourAngleStartH ?? null,
        hourAngleEndH: b.fields?.hourAngleEndH ?? null,
        elevationStartDeg: b.fields?.elevationStartDeg ?? null,
        elevationEndDeg: b.fields?.elevationEndDeg ?? null,
        airmassStart: b.fields?.airmassStart ?? null,
        airmassEnd: b.fields?.airmassEnd ?? null,
        moonSeparationDeg: b.fields?.moonSeparationDeg ?? null,
        outcome: b.outcome,
        note: b.note,
        violations: b.violations,
      }),
    ),
    caution: PLAN_SAFETY_WARNING,
    generatedUtc: new Date().toISOString().replace(/\.\d{3}Z$/, "Z"),
  };
}
