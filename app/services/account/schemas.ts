import * as v from "valibot";
import { sentField } from "~/lib/form-errors";
import { strictNumber } from "~/lib/numbers";
import { TOKEN_LIFETIMES_DAYS, TOKEN_SCOPES } from "~/lib/permissions";
import { requiredText } from "~/lib/text-fields";

/** A session's id as the account page posts it: the SHA-256 of its cookie token, hex. */
const SessionId = v.pipe(v.string(), v.regex(/^[0-9a-f]{64}$/, "Unknown session."));

export const TOKEN_NAME_MAX = 80;

export const TokenName = requiredText(TOKEN_NAME_MAX, {
  empty: "Give the token a name, e.g. the script that will use it.",
  tooLong: `Keep the name to ${TOKEN_NAME_MAX} characters or fewer.`,
});

/** The scopes ticked on the form: at least one, each one of TOKEN_SCOPES. */
const TokenScopes = v.pipe(
  v.array(v.picklist(TOKEN_SCOPES, "Unknown scope.")),
  v.minLength(1, "Tick at least one thing the token may do."),
);

/** Days until the token expires: one of the offered lifetimes, written plainly. */
const TokenLifetime = v.pipe(
  strictNumber("The lifetime", { integer: true }),
  v.check(
    (d) => (TOKEN_LIFETIMES_DAYS as readonly number[]).includes(d),
    `Choose a lifetime of ${TOKEN_LIFETIMES_DAYS.join(", ")} days.`,
  ),
);

/** A token's number as the revoke button posts it: digits only ("12", never "0x0c" or "1e1"). */
const TokenId = v.pipe(
  v.string(),
  v.regex(/^\d{1,10}$/, "Unknown token."),
  v.transform(Number),
  v.integer("Unknown token."),
  v.minValue(1, "Unknown token."),
  v.maxValue(2_147_483_647, "Unknown token."),
);

/** The account page's posts, one per intent. */
export const AccountActionSchema = v.variant(
  "intent",
  [
    v.object({ intent: v.literal("revoke-session"), sessionId: sentField(SessionId) }),
    v.object({ intent: v.literal("revoke-other-sessions") }),
    v.object({
      intent: v.literal("create-token"),
      name: sentField(TokenName),
      scopes: TokenScopes,
      lifetimeDays: sentField(TokenLifetime),
    }),
    v.object({ intent: v.literal("revoke-token"), tokenId: sentField(TokenId) }),
  ],
  "Unknown action.",
);

export type AccountAction = v.InferOutput<typeof AccountActionSchema>;
