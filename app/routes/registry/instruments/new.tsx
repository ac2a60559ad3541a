// /registry/instruments/new — the instrument editor, new page.
// One editor serves both pages: +shared/InstrumentEditor.tsx and +shared/instrument-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { InstrumentEditor } from "../+shared/InstrumentEditor";

export { newInstrumentMeta as meta } from "../+shared/InstrumentEditor";
export { newInstrumentAction as action, newInstrumentLoader as loader } from "../+shared/instrument-editor.server";
export default InstrumentEditor;
export const ErrorBoundary = ErrorPage;
