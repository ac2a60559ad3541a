/**
 * The Calibrator shortlist of a proposal's target: its defaults come from the proposal (its band, the
 * requested configuration with the longest baseline, the night of the cycle when the target crosses the
 * meridian nearest local midnight, the target's own elevation limit and magnitudes), and "Add as
 * calibrator" appends a catalogue star to the target's calibrators. Who may see and change the proposal
 * is the proposals service's rule (404 for anyone off its team, refusals once it is not an editable draft).
 */
import { eq } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { catalogueStars } from "~/db/schema/catalogue";
import type { CalibratorJson } from "~/db/schema/proposals";
import { bandForWavelength, estimateBandMagnitude, estimateDiameterMas, roundTo, TARGET_MATCH_ARCSEC } from "~/engine";
import { loadProposalForViewer, type ProposalViewer, proposalIdFrom } from "~/services/proposals/access.server";
import { ProposalRefusal } from "~/services/proposals/lock.server";
import { requestedHours } from "~/services/proposals/queries.server";
import { PROPOSAL_LIMITS } from "~/services/proposals/schemas";
import { addCalibrator, readProposalTarget } from "~/services/proposals/targets.server";
import { type ShortlistValues, shortlistValues } from "./schemas";
import {
  bestNightIn,
  defaultShortlistValues,
  runShortlist,
  type ShortlistChoices,
  type ShortlistRun,
  shortlistChoices,
} from "./shortlist.server";

type Ids = { viewer: ProposalViewer; proposalId: string | undefined; targetId: string | undefined };

/** The proposal and its target for the viewer (or the 404), with the registry's choices. */
export async function openProposalTarget(db: Database, { viewer, proposalId: rawProposal, targetId: rawTarget }: Ids) {
  const proposalId = proposalIdFrom(rawProposal);
  const targetId = proposalIdFrom(rawTarget);
  const loaded = await loadProposalForViewer(db, { viewer, proposalId });
  const target = await readProposalTarget(db, { proposalId, targetId });
  const hours = await requestedHours(db, { proposalId });
  const choices = await shortlistChoices(db, hours[0]?.configuration.siteId ?? null);
  if (!choices) throw new Response("The array registry has no site yet.", { status: 404 });
  return { viewer, proposalId, targetId, ...loaded, target, requested: hours.map((h) => h.configuration.id), choices };
}

export type OpenedTarget = Awaited<ReturnType<typeof openProposalTarget>>;

/** The proposal's defaults of the shortlist settings (the target itself is fixed). */
function proposalDefaults(choices: ShortlistChoices, o: OpenedTarget, now: Date): ShortlistValues {
  const base = defaultShortlistValues(choices, now);
  const band = choices.bands.find((b) => b.id === o.proposal.bandId);
  const requested = choices.configurations
    .filter((c) => o.requested.includes(c.id))
    .sort((a, b) => b.longestBaselineM - a.longestBaselineM)[0];
  const period = { start: o.cycle.observingStart, end: o.cycle.observingEnd };
  return {
    ...base,
    band: band ? String(band.id) : base.band,
    config: requested ? String(requested.id) : base.config,
    date: bestNightIn(period, o.target.raDeg, choices.site.longitudeDeg),
    minElevation: String(o.target.minElevationDeg ?? choices.site.minElevationDeg),
  };
}

/** Is this shortlisted star already one of the target's calibrators (same star, name or position)? */
export function alreadyCalibrator(
  calibrators: readonly CalibratorJson[],
  star: { hip: number; name: string; raDeg: number; decDeg: number },
): boolean {
  const cosMatch = Math.cos(((TARGET_MATCH_ARCSEC / 3600) * Math.PI) / 180);
  const unit = (ra: number, dec: number) => {
    const [a, d] = [(ra * Math.PI) / 180, (dec * Math.PI) / 180];
    return [Math.cos(d) * Math.cos(a), Math.cos(d) * Math.sin(a), Math.sin(d)];
  };
  const s = unit(star.raDeg, star.decDeg);
  return calibrators.some((c) => {
    if (c.hip === star.hip || c.name.toLowerCase() === star.name.toLowerCase()) return true;
    const u = unit(c.raDeg, c.decDeg);
    return u[0] * s[0] + u[1] * s[1] + u[2] * s[2] >= cosMatch;
  });
}

export type ProposalShortlistPage = {
  proposal: { id: number; title: string };
  target: { id: number; name: string; raDeg: number; decDeg: number; calibrators: number };
  editable: boolean;
  lockedBecause: string | null;
  calibratorsMax: number;
  choices: ShortlistChoices;
  values: ShortlistValues;
  run: ShortlistRun;
  /** HIP numbers of the listed stars that are already calibrators of the target. */
  added: number[];
};

/** The page: settings from the address over the proposal's defaults, and the shortlist. */
export async function proposalTargetShortlist(
  db: Database,
  ids: Ids & { params: URLSearchParams; now?: Date },
): Promise<ProposalShortlistPage> {
  const o = await openProposalTarget(db, ids);
  const values = shortlistValues(ids.params, proposalDefaults(o.choices, o, ids.now ?? new Date()));
  const { target } = o;
  const run = runShortlist(values, o.choices, {
    name: target.name,
    raDeg: target.raDeg,
    decDeg: target.decDeg,
    magnitudes: target.magnitudes,
  });
  return {
    proposal: { id: o.proposal.id, title: o.proposal.title },
    target: {
      id: target.id,
      name: target.name,
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      calibrators: target.calibrators.length,
    },
    editable: o.abilities.canEdit,
    lockedBecause: o.abilities.lockedBecause,
    calibratorsMax: PROPOSAL_LIMITS.calibratorsMax,
    choices: o.choices,
    values,
    run,
    added: (run.result?.calibrators ?? []).filter((c) => alreadyCalibrator(target.calibrators, c)).map((c) => c.hip),
  };
}

/**
 * "Add as calibrator": the catalogue star `hip` (read from catalogue_stars) with its estimated diameter
 * and band magnitude (the band of the page's settings) appended to the target's calibrators.
 */
export async function addShortlistedCalibrator(
  db: Database,
  { opened: o, ...ids }: { opened: OpenedTarget; hip: number; params: URLSearchParams; now?: Date },
): Promise<{ ok: true; text: string } | { ok: false; status: number; message: string }> {
  const [star] = await db.select().from(catalogueStars).where(eq(catalogueStars.hip, ids.hip));
  if (!star) return { ok: false, status: 400, message: `Star: HIP ${ids.hip} is not in the star catalogue.` };
  const values = shortlistValues(ids.params, proposalDefaults(o.choices, o, ids.now ?? new Date()));
  const band = o.choices.bands.find((b) => String(b.id) === values.band) ?? o.choices.bands[0];
  const calibrator: CalibratorJson = { name: star.name, raDeg: star.raDeg, decDeg: star.decDeg, hip: star.hip };
  const bv = star.bv ?? Number.NaN;
  const diameter = estimateDiameterMas(star.vMag, bv);
  if (diameter.ok) calibrator.diameterMas = roundTo(diameter.value, 3);
  if (band) {
    const mag = estimateBandMagnitude(star.vMag, bv, bandForWavelength(band.centralWavelengthM).name);
    if (mag.ok) calibrator.magnitude = roundTo(mag.value, 2);
  }
  try {
    const done = await addCalibrator(db, {
      viewer: o.viewer,
      proposalId: o.proposalId,
      targetId: o.targetId,
      calibrator,
      now: ids.now,
    });
    const estimate = calibrator.diameterMas === undefined ? "" : ` (estimated ${calibrator.diameterMas} mas)`;
    return { ok: true, text: `${star.name}${estimate} added as a calibrator of ${done.target}.` };
  } catch (e) {
    if (e instanceof ProposalRefusal) return { ok: false, status: e.status, message: e.message };
    throw e;
  }
}
