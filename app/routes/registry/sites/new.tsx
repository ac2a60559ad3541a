// /registry/sites/new — the site editor, new page.
// One editor serves both pages: +shared/SiteEditor.tsx and +shared/site-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { SiteEditor } from "../+shared/SiteEditor";

export { newSiteMeta as meta } from "../+shared/SiteEditor";
export { newSiteAction as action, newSiteLoader as loader } from "../+shared/site-editor.server";
export default SiteEditor;
export const ErrorBoundary = ErrorPage;
