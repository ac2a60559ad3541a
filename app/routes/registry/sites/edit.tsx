// /registry/sites/:siteId/edit — the site editor, edit page.
// One editor serves both pages: +shared/SiteEditor.tsx and +shared/site-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { SiteEditor } from "../+shared/SiteEditor";

export { editSiteMeta as meta } from "../+shared/SiteEditor";
export { editSiteAction as action, editSiteLoader as loader } from "../+shared/site-editor.server";
export default SiteEditor;
export const ErrorBoundary = ErrorPage;
