export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { editSiteMeta as meta, SiteEditor as default } from "../+shared/SiteEditor";
export { editSiteAction as action, editSiteLoader as loader } from "../+shared/site-editor.server";
