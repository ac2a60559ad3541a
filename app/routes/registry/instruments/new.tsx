export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { InstrumentEditor as default, newInstrumentMeta as meta } from "../+shared/InstrumentEditor";
export { newInstrumentAction as action, newInstrumentLoader as loader } from "../+shared/instrument-editor.server";
