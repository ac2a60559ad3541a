export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { editStationMeta as meta, StationEditor as default } from "../+shared/StationEditor";
export { editStationAction as action, editStationLoader as loader } from "../+shared/station-editor.server";
