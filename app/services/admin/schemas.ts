import * as v from "valibot";
import { ROLES } from "~/db/schema/users";
import { sentField } from "~/lib/form-errors";

/** A person's number as the People page posts it: digits only ("12", never "0x0c", "1e1" or " 12"). */
const PersonId = v.pipe(
  v.string("Unknown person."),
  v.regex(/^\d{1,10}$/, "Unknown person."),
  v.transform(Number),
  v.minValue(1, "Unknown person."),
  v.maxValue(2_147_483_647, "Unknown person."),
);

/** The People page's posts: a person's roles, or their account switched off or on again. */
export const PeopleActionSchema = v.variant(
  "intent",
  [
    v.object({
      intent: v.literal("set-roles"),
      userId: sentField(PersonId),
      roles: v.array(v.picklist(ROLES, "Unknown role.")),
    }),
    v.object({ intent: v.literal("deactivate"), userId: sentField(PersonId) }),
    v.object({ intent: v.literal("reactivate"), userId: sentField(PersonId) }),
  ],
  "Unknown action.",
);

export type PeopleAction = v.InferOutput<typeof PeopleActionSchema>;

/** Longest search text on the People page, characters (stated beside the search box). */
export const PEOPLE_QUERY_MAX = 100;
