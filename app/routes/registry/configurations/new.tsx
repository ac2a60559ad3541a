export { ErrorPage as ErrorBoundary } from "~/components/ErrorPage";
export { ConfigurationEditor as default, newConfigurationMeta as meta } from "../+shared/ConfigurationEditor";
export {
  newConfigurationAction as action,
  newConfigurationLoader as loader,
} from "../+shared/configuration-editor.server";
