export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { newSiteMeta as meta, SiteEditor as default } from "../+shared/SiteEditor";
export { newSiteAction as action, newSiteLoader as loader } from "../+shared/site-editor.server";
