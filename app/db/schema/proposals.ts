import { sql } from "drizzle-orm";
import {
  check,
  customType,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  uniqueIndex,
} from "drizzle-orm/pg-core";
import { bands, configurations, instruments } from "./array";
import { instant, keyRefTo, optionalRefTo, refTo, serialId, timestamps } from "./columns";
import { users } from "./users";

const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
});

/**
 * A target model as the API takes it (CONVENTIONS.md): `{type: "uniformDisk", diameterMas: 3}` etc.
 * Validated by the request schemas in app/engine/api/requests.ts before it is stored.
 */
export type TargetModelJson = { type: string; [key: string]: unknown };
/** Magnitude per band name, e.g. `{ "H": 4.2, "K": 3.9 }`. */
export type MagnitudesJson = Record<string, number>;
/**
 * The closure triangle chosen for a target in the Triangle finder: its three stations in the order
 * ranked, and what it was ranked for (the site, an instrument's band, and a configuration or null for
 * every station of the site).
 */
export type ClosureTriangleJson = {
  stations: [string, string, string];
  site: string;
  instrument: string;
  band: string;
  configuration: string | null;
};

/** A time-critical window, ISO-8601 UTC instants. */
export type TimeWindowJson = { startUtc: string; endUtc: string; note?: string };
export type CalibratorJson = {
  name: string;
  raDeg: number;
  decDeg: number;
  diameterMas?: number;
  magnitude?: number;
  /** Hipparcos number of the catalogue star the calibrator was taken from (catalogue_stars.hip). */
  hip?: number;
};

/**
 * Where a cycle stands in the committee's season: being prepared (draft), taking proposals (open), with
 * the reviewers (reviewing), with the chair for decisions (deciding), decisions sent (closed).
 */
export const CYCLE_STATES = ["draft", "open", "reviewing", "deciding", "closed"] as const;
export type CycleState = (typeof CYCLE_STATES)[number];
export const cycleStateEnum = pgEnum("cycle_state", CYCLE_STATES);

/** An observing cycle: its period, the submission deadline, and the configurations on offer. */
export const cycles = pgTable(
  "cycles",
  {
    id: serialId(),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    /** First and last night of the observing period (nights of date D begin on the evening of D). */
    observingStart: date("observing_start").notNull(),
    observingEnd: date("observing_end").notNull(),
    submissionDeadline: instant("submission_deadline").notNull(),
    /** The committee's season; cycles that existed before it default to taking proposals. */
    state: cycleStateEnum("state").notNull().default("open"),
    /** Reviews must be submitted before this instant (the chair may reopen scoring by moving it). */
    reviewDeadline: instant("review_deadline"),
    /** The day the committee's decisions are due to be sent. */
    decisionDate: date("decision_date"),
    /** The score scale's two ends: `scoreBest` the best score, `scoreWorst` the poorest (default 1 … 5). */
    scoreBest: integer("score_best").notNull().default(1),
    scoreWorst: integer("score_worst").notNull().default(5),
    createdById: optionalRefTo(() => users.id),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("cycles_name_key").on(t.name),
    check("cycles_period_check", sql`${t.observingEnd} >= ${t.observingStart}`),
    check("cycles_score_scale_check", sql`${t.scoreBest} <> ${t.scoreWorst}`),
  ],
);

export const cycleConfigurations = pgTable(
  "cycle_configurations",
  {
    cycleId: refTo(() => cycles.id),
    configurationId: refTo(() => configurations.id, "restrict"),
    /** Nights the configuration is on the array this cycle (the committee's capacity), if known. */
    nightsAvailable: doublePrecision("nights_available"),
  },
  (t) => [primaryKey({ columns: [t.cycleId, t.configurationId] })],
);

/**
 * What a target is, as a person describes it: its name, position, model and magnitudes. A proposal's
 * targets carry their own copy (see proposalTargets), so both tables declare the same columns.
 */
function targetDescription() {
  return {
    name: text("name").notNull(),
    /** J2000 right ascension and declination, degrees. */
    raDeg: doublePrecision("ra_deg").notNull(),
    decDeg: doublePrecision("dec_deg").notNull(),
    model: jsonb("model").$type<TargetModelJson>().notNull(),
    magnitudes: jsonb("magnitudes").$type<MagnitudesJson>().notNull().default({}),
  };
}

/** A proposer's own list of targets ("My targets"), reused across sketches and proposals. */
export const targets = pgTable(
  "targets",
  {
    id: serialId(),
    ownerId: refTo(() => users.id),
    ...targetDescription(),
    notes: text("notes").notNull().default(""),
    ...timestamps,
  },
  (t) => [uniqueIndex("targets_owner_name_key").on(t.ownerId, sql`lower(${t.name})`)],
);

export const PROPOSAL_STATUSES = [
  "draft",
  "submitted",
  "under_review",
  "accepted",
  "waitlisted",
  "declined",
  "scheduled",
  "withdrawn",
] as const;
export type ProposalStatus = (typeof PROPOSAL_STATUSES)[number];
export const proposalStatusEnum = pgEnum("proposal_status", PROPOSAL_STATUSES);

export const SCIENCE_CATEGORIES = [
  "Stellar surfaces and diameters",
  "Binary and multiple stars",
  "Circumstellar environments",
  "Young stellar objects and discs",
  "Evolved stars and mass loss",
  "Active galactic nuclei",
  "Solar system",
  "Other",
] as const;

export const proposals = pgTable(
  "proposals",
  {
    id: serialId(),
    cycleId: refTo(() => cycles.id, "restrict"),
    piId: refTo(() => users.id, "restrict"),
    title: text("title").notNull().default(""),
    abstract: text("abstract").notNull().default(""),
    scienceCategory: text("science_category").notNull().default(""),
    instrumentId: optionalRefTo(() => instruments.id, "restrict"),
    bandId: optionalRefTo(() => bands.id, "restrict"),
    status: proposalStatusEnum("status").notNull().default("draft"),
    /** When the latest version was submitted (null while a draft). */
    submittedAt: instant("submitted_at"),
    /** Number of the latest frozen version; 0 while never submitted. */
    currentVersion: integer("current_version").notNull().default(0),
    ...timestamps,
  },
  (t) => [index("proposals_cycle_idx").on(t.cycleId), index("proposals_pi_idx").on(t.piId)],
);

/** Co-investigators, invited by e-mail; linked to an account once one exists for that address. */
export const proposalMembers = pgTable(
  "proposal_members",
  {
    id: serialId(),
    proposalId: refTo(() => proposals.id),
    email: text("email").notNull(),
    userId: optionalRefTo(() => users.id),
    invitedAt: instant("invited_at").notNull().defaultNow(),
  },
  (t) => [uniqueIndex("proposal_members_email_key").on(t.proposalId, sql`lower(${t.email})`)],
);

/**
 * Hours of a proposal per configuration (one row a configuration, more than 0 h): what it requests
 * (proposal_hours) or what the committee grants it (allocated_hours).
 */
export function hoursPerConfiguration<TName extends string>(name: TName) {
  return pgTable(
    name,
    {
      proposalId: refTo(() => proposals.id),
      configurationId: refTo(() => configurations.id, "restrict"),
      hours: doublePrecision("hours").notNull(),
    },
    (t) => [primaryKey({ columns: [t.proposalId, t.configurationId] }), check(`${name}_positive`, sql`${t.hours} > 0`)],
  );
}

/** Hours requested per configuration. */
export const proposalHours = hoursPerConfiguration("proposal_hours");

/**
 * The targets of a proposal. Coordinates, model and magnitudes are copied in (from "My targets" or
 * typed), so the proposal's team can edit them and a submitted version stays as it was.
 */
export const proposalTargets = pgTable(
  "proposal_targets",
  {
    id: serialId(),
    proposalId: refTo(() => proposals.id),
    position: integer("position").notNull().default(0),
    sourceTargetId: optionalRefTo(() => targets.id),
    ...targetDescription(),
    /** Minimum elevation for this target, degrees; null = the site's. */
    minElevationDeg: doublePrecision("min_elevation_deg"),
    timeWindows: jsonb("time_windows").$type<TimeWindowJson[]>().notNull().default([]),
    calibrators: jsonb("calibrators").$type<CalibratorJson[]>().notNull().default([]),
    notes: text("notes").notNull().default(""),
    /** The closure triangle chosen in the Triangle finder; null until one is. */
    closureTriangle: jsonb("closure_triangle").$type<ClosureTriangleJson>(),
  },
  (t) => [index("proposal_targets_proposal_idx").on(t.proposalId)],
);

/** The science case, a PDF stored in the database (one per proposal). */
export const proposalDocuments = pgTable("proposal_documents", {
  proposalId: keyRefTo(() => proposals.id),
  filename: text("filename").notNull(),
  contentType: text("content_type").notNull(),
  sizeBytes: integer("size_bytes").notNull(),
  sha256: text("sha256").notNull(),
  data: bytea("data").notNull(),
  uploadedById: optionalRefTo(() => users.id),
  uploadedAt: instant("uploaded_at").notNull().defaultNow(),
});

/** A frozen copy of a proposal at submission: what the committee reviews. */
export const proposalVersions = pgTable(
  "proposal_versions",
  {
    id: serialId(),
    proposalId: refTo(() => proposals.id),
    version: integer("version").notNull(),
    submittedAt: instant("submitted_at").notNull().defaultNow(),
    submittedById: optionalRefTo(() => users.id),
    /** Everything the proposal said, with its feasibility report, as JSON. */
    snapshot: jsonb("snapshot").$type<Record<string, unknown>>().notNull(),
    /** The science case as it was at submission. */
    documentSha256: text("document_sha256"),
    documentData: bytea("document_data"),
  },
  (t) => [uniqueIndex("proposal_versions_key").on(t.proposalId, t.version)],
);
