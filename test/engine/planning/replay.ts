/**
 * An independent replay of a plan for the tests: every block is re-evaluated every 30 s and at both
 * ends with the engine's elementary functions (Sun altitude, sidereal time, precession, Moon), the
 * composition written here afresh: hour angle and elevation (Meeus 1998 eq. 13.6), projected w
 * (Thompson, Moran & Swenson 2017 eq. 4.1), the Moon's distance by the spherical law of cosines
 * (Meeus 1998 eq. 17.1) both geocentric and topocentric (parallax, Meeus 1998 ch. 40, with
 * b/a = 0.99664719 from ch. 11). No safety margins: these are the contract's bare limits.
 */
import {
  computeEphemeris,
  elevationRad,
  enuToEquatorial,
  jdeFromJd,
  lmstRad,
  moonPosition,
  nightEvents,
  type PlanInput,
  type PlanResponse,
  parseIsoDate,
  precessFromJ2000,
  sunAltitudeRad,
} from "~/engine";

const D = Math.PI / 180;
const jdOf = (ms: number) => ms / 86_400_000 + 2440587.5;

function separationDeg(ra1: number, de1: number, ra2: number, de2: number): number {
  const c = Math.sin(de1) * Math.sin(de2) + Math.cos(de1) * Math.cos(de2) * Math.cos(ra1 - ra2);
  return Math.acos(Math.min(1, Math.max(-1, c))) / D;
}

/** Topocentric place of the Moon (Meeus ch. 40), radians. */
function topocentricMoon(
  raRad: number,
  decRad: number,
  distanceKm: number,
  latRad: number,
  altM: number,
  haRad: number,
) {
  const u = Math.atan(0.99664719 * Math.tan(latRad));
  const rhoSin = 0.99664719 * Math.sin(u) + (altM / 6378140) * Math.sin(latRad);
  const rhoCos = Math.cos(u) + (altM / 6378140) * Math.cos(latRad);
  const sinPi = 6378.14 / distanceKm;
  const dRa = Math.atan2(-rhoCos * sinPi * Math.sin(haRad), Math.cos(decRad) - rhoCos * sinPi * Math.cos(haRad));
  const dec = Math.atan2(
    (Math.sin(decRad) - rhoSin * sinPi) * Math.cos(dRa),
    Math.cos(decRad) - rhoCos * sinPi * Math.cos(haRad),
  );
  return { raRad: raRad + dRa, decRad: dec };
}

/** Every breach of the contract found in a plan; empty when it keeps every rule. */
export function replayPlan(req: PlanInput, plan: PlanResponse, stepSec = 30): string[] {
  const out: string[] = [];
  const lat = req.site.latitudeDeg * D;
  const lon = req.site.longitudeDeg * D;
  const date = parseIsoDate(req.date);
  if (!date) return ["bad date"];
  const ev = nightEvents(date, lat, lon);
  const epoch = jdeFromJd(ev.localMidnightJd);
  const eph = computeEphemeris({ site: req.site, date: req.date });
  const xyz = req.stations.map((s) => enuToEquatorial(s.eastM, s.northM, s.upM, lat));
  const targets = new Map(req.targets.map((t) => [t.name, t]));
  const blocks = plan.blocks;
  const whole = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ$/;

  for (let i = 0; i < blocks.length; i++) {
    const b = blocks[i];
    const tag = `block ${i} (${b.kind} ${b.object} ${b.startUtc})`;
    if (!whole.test(b.startUtc) || !whole.test(b.endUtc)) out.push(`${tag}: not whole seconds`);
    const s = Date.parse(b.startUtc);
    const e = Date.parse(b.endUtc);
    if (!(e > s)) out.push(`${tag}: empty`);
    if (i > 0 && s < Date.parse(blocks[i - 1].endUtc)) out.push(`${tag}: overlaps or out of order`);
    if (eph.astronomicalDuskUtc && s < Date.parse(eph.astronomicalDuskUtc)) out.push(`${tag}: before dusk`);
    if (eph.astronomicalDawnUtc && e > Date.parse(eph.astronomicalDawnUtc)) out.push(`${tag}: after dawn`);
    const t = targets.get(b.target);
    if (!t) {
      out.push(`${tag}: unknown target`);
      continue;
    }
    const obj = b.kind === "science" ? t : t.calibrators.find((c) => c.name === b.object);
    if (!obj || (b.kind === "science" && b.object !== t.name)) {
      out.push(`${tag}: object is not the target or one of its calibrators`);
      continue;
    }
    const limits =
      b.kind === "science"
        ? [t.minElevationDeg ?? req.minElevationDeg]
        : [t.minElevationDeg ?? req.minElevationDeg, req.minElevationDeg];
    const place = precessFromJ2000(obj.raDeg * D, obj.decDeg * D, epoch);
    const times: number[] = [];
    for (let ms = s; ms < e; ms += stepSec * 1000) times.push(ms);
    times.push(e);
    for (const ms of times) {
      const jd = jdOf(ms);
      const at = new Date(ms).toISOString();
      if (!(sunAltitudeRad(jd, lat, lon) < -18 * D)) out.push(`${tag}: Sun above −18° at ${at}`);
      const ha = lmstRad(jd, lon) - place.raRad;
      const el = elevationRad(lat, place.decRad, ha) / D;
      for (const lim of limits) if (!(el >= lim)) out.push(`${tag}: elevation ${el.toFixed(3)} < ${lim} at ${at}`);
      if (req.delayLineStrokeM !== null) {
        for (let p = 0; p < xyz.length; p++) {
          for (let q = p + 1; q < xyz.length; q++) {
            const X = xyz[q].xM - xyz[p].xM;
            const Y = xyz[q].yM - xyz[p].yM;
            const Z = xyz[q].zM - xyz[p].zM;
            const w =
              Math.cos(place.decRad) * Math.cos(ha) * X -
              Math.cos(place.decRad) * Math.sin(ha) * Y +
              Math.sin(place.decRad) * Z;
            const need = Math.abs(w + req.stations[q].pathOffsetM - req.stations[p].pathOffsetM);
            if (!(need <= req.delayLineStrokeM)) out.push(`${tag}: delay ${need.toFixed(2)} m > stroke at ${at}`);
          }
        }
      }
      if (req.moonMinSeparationDeg > 0) {
        const m = moonPosition(jdeFromJd(jd));
        const geo = separationDeg(place.raRad, place.decRad, m.raRad, m.decRad);
        const topo = topocentricMoon(
          m.raRad,
          m.decRad,
          m.distanceKm,
          lat,
          req.site.altitudeM,
          lmstRad(jd, lon) - m.raRad,
        );
        const top = separationDeg(place.raRad, place.decRad, topo.raRad, topo.decRad);
        if (!(Math.min(geo, top) >= req.moonMinSeparationDeg))
          out.push(`${tag}: Moon ${geo.toFixed(2)}°/${top.toFixed(2)}° at ${at}`);
      }
    }
  }

  // Sequences: calibrator – science – calibrator, touching; no calibrator block serves two.
  const isCalOf = (j: number, target: string) =>
    blocks[j]?.kind === "calibrator" &&
    blocks[j].target === target &&
    (targets.get(target)?.calibrators.some((c) => c.name === blocks[j].object) ?? false);
  const used = new Map<string, { sec: number; n: number }>();
  for (let i = 0; i < blocks.length; i++) {
    const b = blocks[i];
    if (b.kind !== "science") continue;
    if (!isCalOf(i - 1, b.target) || blocks[i - 1].endUtc !== b.startUtc)
      out.push(`science ${i}: no calibrator right before`);
    if (!isCalOf(i + 1, b.target) || blocks[i + 1].startUtc !== b.endUtc)
      out.push(`science ${i}: no calibrator right after`);
    if (blocks[i + 2]?.kind === "science" && blocks[i + 2].target === b.target && isCalOf(i + 1, b.target)) {
      out.push(`calibrator ${i + 1}: serves two sequences`);
    }
    const u = used.get(b.target) ?? { sec: 0, n: 0 };
    u.sec += (Date.parse(b.endUtc) - Date.parse(b.startUtc)) / 1000;
    u.n += 1;
    used.set(b.target, u);
  }
  for (const [name, u] of used) {
    const t = targets.get(name);
    if (!t) continue;
    const blocksOwed = Math.ceil((t.hoursOwed * 60) / req.scienceBlockMin);
    if (u.n > blocksOwed || u.sec > blocksOwed * req.scienceBlockMin * 60 + 1e-6) out.push(`${name}: over hours owed`);
  }
  for (const u of plan.unplaced) if (used.has(u.target)) out.push(`${u.target}: unplaced but has science time`);
  for (const t of req.targets) {
    if (!used.has(t.name) && !plan.unplaced.some((u) => u.target === t.name))
      out.push(`${t.name}: no time and no reason`);
  }
  return out;
}
