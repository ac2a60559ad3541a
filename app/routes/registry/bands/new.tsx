export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { BandEditor as default, newBandMeta as meta } from "../+shared/BandEditor";
export { newBandAction as action, newBandLoader as loader } from "../+shared/band-editor.server";
