import * as v from "valibot";
import { ROLES } from "~/db/schema/users";

const PersonId = v.pipe(
  v.string(),
  v.transform(Number),
  v.integer("Unknown person."),
  v.minValue(1, "Unknown person."),
);

/** The People page's posts: a person's roles, or their account switched off or on again. */
export const PeopleActionSchema = v.variant("intent", [
  v.object({ intent: v.literal("set-roles"), userId: PersonId, roles: v.array(v.picklist(ROLES, "Unknown role.")) }),
  v.object({ intent: v.literal("deactivate"), userId: PersonId }),
  v.object({ intent: v.literal("reactivate"), userId: PersonId }),
]);

export type PeopleAction = v.InferOutput<typeof PeopleActionSchema>;
