export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { ConfigurationEditor as default, editConfigurationMeta as meta } from "../+shared/ConfigurationEditor";
export {
  editConfigurationAction as action,
  editConfigurationLoader as loader,
} from "../+shared/configuration-editor.server";
