// /registry/bands/:bandId/edit — the band editor, edit page.
// One editor serves both pages: +shared/BandEditor.tsx and +shared/band-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { BandEditor } from "../+shared/BandEditor";

export { editBandMeta as meta } from "../+shared/BandEditor";
export { editBandAction as action, editBandLoader as loader } from "../+shared/band-editor.server";
export default BandEditor;
export const ErrorBoundary = ErrorPage;
