// /registry/stations/:stationId/edit — the station editor, edit page.
// One editor serves both pages: +shared/StationEditor.tsx and +shared/station-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { StationEditor } from "../+shared/StationEditor";

export { editStationMeta as meta } from "../+shared/StationEditor";
export { editStationAction as action, editStationLoader as loader } from "../+shared/station-editor.server";
export default StationEditor;
export const ErrorBoundary = ErrorPage;
