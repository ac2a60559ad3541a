// /registry/stations/new — the station editor, new page.
// One editor serves both pages: +shared/StationEditor.tsx and +shared/station-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { StationEditor } from "../+shared/StationEditor";

export { newStationMeta as meta } from "../+shared/StationEditor";
export { newStationAction as action, newStationLoader as loader } from "../+shared/station-editor.server";
export default StationEditor;
export const ErrorBoundary = ErrorPage;
