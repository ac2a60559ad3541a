import * as v from "valibot";
import { SECRET_PATTERN } from "./tokens.server";

/** The sign-in page's request for a link by e-mail. */
export const EmailLinkRequestSchema = v.object({
  email: v.pipe(
    v.string("Please give your e-mail address."),
    v.trim(),
    v.nonEmpty("Please give your e-mail address."),
    v.maxLength(254, "That e-mail address is too long."),
    v.email("That does not look like an e-mail address."),
  ),
  next: v.optional(v.string("The destination after sign-in must be a path."), "/"),
});

/** A sign-in link as it comes back: its token (shown in the page, posted by its button) and the way on. */
export const SignInLinkSchema = v.object({
  // A missing token reads as "" and fails the pattern with the same sentence.
  token: v.pipe(
    v.optional(v.string("This sign-in link is not valid."), ""),
    v.regex(SECRET_PATTERN, "This sign-in link is not valid."),
  ),
  next: v.optional(v.string(), "/"),
});
