// /registry/instruments/:instrumentId/edit — the instrument editor, edit page.
// One editor serves both pages: +shared/InstrumentEditor.tsx and +shared/instrument-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { InstrumentEditor } from "../+shared/InstrumentEditor";

export { editInstrumentMeta as meta } from "../+shared/InstrumentEditor";
export { editInstrumentAction as action, editInstrumentLoader as loader } from "../+shared/instrument-editor.server";
export default InstrumentEditor;
export const ErrorBoundary = ErrorPage;
