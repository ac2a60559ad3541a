import type { ShouldRevalidateFunctionArgs } from "react-router";

/**
 * The registry does not change while the inputs of the Sketchpad or the Triangle finder are edited
 * (they live in the URL): only a different site, or a form post, needs the loader again.
 */
export function sketchShouldRevalidate({
  currentUrl,
  nextUrl,
  formMethod,
  defaultShouldRevalidate,
}: ShouldRevalidateFunctionArgs) {
  if (
    !formMethod &&
    currentUrl.pathname === nextUrl.pathname &&
    currentUrl.searchParams.get("site") === nextUrl.searchParams.get("site")
  ) {
    return false;
  }
  return defaultShouldRevalidate;
}
