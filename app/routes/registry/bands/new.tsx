// /registry/instruments/:instrumentId/bands/new — the band editor, new page.
// One editor serves both pages: +shared/BandEditor.tsx and +shared/band-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { BandEditor } from "../+shared/BandEditor";

export { newBandMeta as meta } from "../+shared/BandEditor";
export { newBandAction as action, newBandLoader as loader } from "../+shared/band-editor.server";
export default BandEditor;
export const ErrorBoundary = ErrorPage;
