/**
 * The rules a proposal's fields are held to: the limits (shown on the pages), each field's rule once,
 * and the form schemas composed from them. Pure: safe in the browser.
 */
import * as v from "valibot";
import { SCIENCE_CATEGORIES } from "~/db/schema/proposals";
import { countWords } from "./words";

/** The limits a proposal's fields are held to (shown on the pages, checked by the schemas). */
export const PROPOSAL_LIMITS = {
  titleMaxChars: 200,
  abstractMaxWords: 300,
  abstractMaxChars: 4000,
  hoursMax: 200,
  coInvestigatorsMax: 30,
  targetsMax: 50,
  targetNotesMaxChars: 2000,
  windowsMax: 20,
  calibratorsMax: 10,
} as const;

const L = PROPOSAL_LIMITS;

// ---------------------------------------------------------------- field rules

/** A title: one line of at most `titleMaxChars`; `empty` is the message for none. */
export const titleField = (empty: string) =>
  v.pipe(
    v.string("Title: write a title."),
    v.trim(),
    v.nonEmpty(empty),
    v.regex(/^[^\r\n\t]*$/, "Title: must be a single line."),
    v.maxLength(L.titleMaxChars, `Title: at most ${L.titleMaxChars} characters.`),
  );

export const abstractField = v.pipe(
  v.string(),
  v.trim(),
  v.maxLength(L.abstractMaxChars, `Abstract: at most ${L.abstractMaxChars} characters.`),
  v.check((s) => countWords(s) <= L.abstractMaxWords, `Abstract: at most ${L.abstractMaxWords} words.`),
);

export const scienceCategoryField = v.union(
  [v.literal(""), v.picklist(SCIENCE_CATEGORIES)],
  "Science category: choose one of the categories listed.",
);

/** A band id from the list, or "" for none yet (→ null). */
export const bandIdField = v.pipe(
  v.string(),
  v.regex(/^(\d{1,9})?$/, "Instrument and band: choose one of the bands listed."),
  v.transform((s) => (s === "" ? null : Number(s))),
);

export const cycleIdField = v.pipe(
  v.string("Cycle: choose one of the open cycles."),
  v.regex(/^\d{1,9}$/, "Cycle: choose one of the open cycles."),
  v.transform(Number),
);

export const coInvestigatorEmailField = v.pipe(
  v.string(),
  v.trim(),
  v.nonEmpty("Co-investigator e-mail: write an address."),
  v.maxLength(320, "Co-investigator e-mail: too long."),
  v.email("Co-investigator e-mail: not an e-mail address."),
);

/** The id of an item of the page (a member, a target), posted by a button. */
export const itemIdField = v.pipe(v.string(), v.regex(/^\d{1,9}$/, "Unknown item."), v.transform(Number));

/** Hours for one configuration: empty for none (→ null), else more than 0 and at most `hoursMax`. */
export const hoursField = v.pipe(
  v.string(),
  v.trim(),
  v.transform((s) => (s === "" ? null : Number(s))),
  v.nullable(
    v.pipe(
      v.number("must be a number of hours"),
      v.finite("must be a number of hours"),
      v.gtValue(0, "must be more than 0 h (leave it empty to request none)"),
      v.maxValue(L.hoursMax, `must be at most ${L.hoursMax} h`),
    ),
  ),
);

export const moveDirectionField = v.picklist(["up", "down"]);

// ---------------------------------------------------------------- form schemas

/** The new-proposal form: the cycle and a working title. */
export const NewProposalSchema = v.object({
  cycleId: cycleIdField,
  title: titleField("Title: write a title (it can change later)."),
});

/** The proposal's text: title, abstract, science category and band. */
export const DetailsSchema = v.object({
  title: titleField("Title: must not be empty."),
  abstract: abstractField,
  scienceCategory: scienceCategoryField,
  bandId: bandIdField,
});

/** Moving a target one place up or down. */
export const MoveTargetSchema = v.object({ targetId: itemIdField, direction: moveDirectionField });

export type DetailsInput = v.InferOutput<typeof DetailsSchema>;
