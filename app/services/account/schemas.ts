import * as v from "valibot";

/** A session's id as the account page posts it: the SHA-256 of its cookie token, hex. */
const SessionId = v.pipe(v.string(), v.regex(/^[0-9a-f]{64}$/, "Unknown session."));

export const TokenName = v.pipe(
  v.string(),
  v.trim(),
  v.nonEmpty("Give the token a name, e.g. the script that will use it."),
  v.maxLength(80, "Keep the name under 80 characters."),
);

/** The account page's posts, one per intent. */
export const AccountActionSchema = v.variant("intent", [
  v.object({ intent: v.literal("revoke-session"), sessionId: SessionId }),
  v.object({ intent: v.literal("revoke-other-sessions") }),
  v.object({ intent: v.literal("create-token"), name: TokenName }),
  v.object({
    intent: v.literal("revoke-token"),
    tokenId: v.pipe(v.string(), v.transform(Number), v.integer("Unknown token.")),
  }),
]);

export type AccountAction = v.InferOutput<typeof AccountActionSchema>;
