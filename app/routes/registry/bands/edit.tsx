export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { BandEditor as default, editBandMeta as meta } from "../+shared/BandEditor";
export { editBandAction as action, editBandLoader as loader } from "../+shared/band-editor.server";
