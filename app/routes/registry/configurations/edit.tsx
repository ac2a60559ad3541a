// /registry/configurations/:configurationId/edit — the configuration editor, edit page.
// One editor serves both pages: +shared/ConfigurationEditor.tsx and +shared/configuration-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { ConfigurationEditor } from "../+shared/ConfigurationEditor";

export { editConfigurationMeta as meta } from "../+shared/ConfigurationEditor";
export {
  editConfigurationAction as action,
  editConfigurationLoader as loader,
} from "../+shared/configuration-editor.server";
export default ConfigurationEditor;
export const ErrorBoundary = ErrorPage;
