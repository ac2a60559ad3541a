export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { newStationMeta as meta, StationEditor as default } from "../+shared/StationEditor";
export { newStationAction as action, newStationLoader as loader } from "../+shared/station-editor.server";
