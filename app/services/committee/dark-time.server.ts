/**
 * The darkness of a cycle's period, computed by the engine once (every night, 24 LST bins of 1 h) and
 * kept in cycle_dark_time: it depends only on the site and the period, not on the proposals, so the
 * Ranking board and the cycle page read it instead of recomputing ~180 nights of twilight on every load.
 * A stored entry whose fingerprint (site position, period, bins) no longer matches is recomputed.
 */
import { and, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { cycleDarkTime } from "~/db/schema/committee";
import { type DarkTime, darkTimeOverPeriod } from "~/engine";

export const DARK_LST_BINS = 24;

export type DarkSite = { id: number; latitudeDeg: number; longitudeDeg: number; altitudeM: number };

export function darkFingerprint(site: DarkSite, first: string, last: string): string {
  return `${site.latitudeDeg},${site.longitudeDeg},${site.altitudeM}|${first}|${last}|${DARK_LST_BINS}|1`;
}

/** DarkTime as JSON (typed arrays as plain arrays). */
export function serializeDarkTime(d: DarkTime): Record<string, unknown> {
  return { ...d, hoursPerBin: Array.from(d.hoursPerBin), meanDarkHoursPerBin: Array.from(d.meanDarkHoursPerBin) };
}

export function deserializeDarkTime(json: Record<string, unknown>): DarkTime {
  const d = json as unknown as DarkTime & { hoursPerBin: number[]; meanDarkHoursPerBin: number[] };
  return {
    ...d,
    hoursPerBin: Float64Array.from(d.hoursPerBin),
    meanDarkHoursPerBin: Float64Array.from(d.meanDarkHoursPerBin),
  };
}

/** The darkness of the period at each site, from the store or computed (and stored) when missing or stale. */
export async function cycleDarkness(
  db: DbOrTx,
  { cycleId, first, last, sites }: { cycleId: number; first: string; last: string; sites: DarkSite[] },
): Promise<Map<number, DarkTime>> {
  const out = new Map<number, DarkTime>();
  if (sites.length === 0) return out;
  const stored = await db
    .select()
    .from(cycleDarkTime)
    .where(
      and(
        eq(cycleDarkTime.cycleId, cycleId),
        inArray(
          cycleDarkTime.siteId,
          sites.map((s) => s.id),
        ),
      ),
    );
  for (const site of sites) {
    const fingerprint = darkFingerprint(site, first, last);
    const hit = stored.find((s) => s.siteId === site.id && s.fingerprint === fingerprint);
    if (hit) {
      out.set(site.id, deserializeDarkTime(hit.darkTime));
      continue;
    }
    const dark = darkTimeOverPeriod(
      { latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM },
      first,
      last,
      { lstBins: DARK_LST_BINS, everyNights: 1 },
    );
    const darkTime = serializeDarkTime(dark);
    await db
      .insert(cycleDarkTime)
      .values({ cycleId, siteId: site.id, fingerprint, darkTime, computedAt: new Date() })
      .onConflictDoUpdate({
        target: [cycleDarkTime.cycleId, cycleDarkTime.siteId],
        set: { fingerprint, darkTime, computedAt: new Date() },
      });
    out.set(site.id, dark);
  }
  return out;
}
