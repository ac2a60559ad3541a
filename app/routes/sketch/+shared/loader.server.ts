import type { LoaderFunctionArgs } from "react-router";
import { dbContext } from "~/context";
import { requirePermission } from "~/lib/guards.server";
import { loadSketchPage } from "~/services/sketch/page.server";

/** What a page asks of `loadSketchPage` beyond the viewer and the address. */
type SketchPageOptions = Omit<Parameters<typeof loadSketchPage>[1], "viewer" | "url">;

/**
 * The loader of a Sketchpad-like page (the Sketchpad, the Triangle finder): anyone who may sketch, the
 * registry's sites and the inputs of the URL; `purpose` ends the message shown when no site can serve.
 */
export function sketchLoader(options: SketchPageOptions) {
  return async ({ request, url, context }: LoaderFunctionArgs) => {
    const viewer = await requirePermission(request, "sketch:use");
    return loadSketchPage(context.get(dbContext), { viewer, url, ...options });
  };
}
