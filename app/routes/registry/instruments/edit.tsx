export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { editInstrumentMeta as meta, InstrumentEditor as default } from "../+shared/InstrumentEditor";
export { editInstrumentAction as action, editInstrumentLoader as loader } from "../+shared/instrument-editor.server";
