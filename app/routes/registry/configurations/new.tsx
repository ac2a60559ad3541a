// /registry/configurations/new — the configuration editor, new page.
// One editor serves both pages: +shared/ConfigurationEditor.tsx and +shared/configuration-editor.server.ts.
import { ErrorPage } from "~/components/ErrorPage";
import { ConfigurationEditor } from "../+shared/ConfigurationEditor";

export { newConfigurationMeta as meta } from "../+shared/ConfigurationEditor";
export {
  newConfigurationAction as action,
  newConfigurationLoader as loader,
} from "../+shared/configuration-editor.server";
export default ConfigurationEditor;
export const ErrorBoundary = ErrorPage;
