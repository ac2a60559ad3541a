import { type RouteConfig, index, prefix, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),
  ...prefix("registry", [index("routes/registry/overview.tsx")]),
  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
