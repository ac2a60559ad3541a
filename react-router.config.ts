import type { Config } from "@react-router/dev/config";

export default {
  appDirectory: "app",
  // BUILD_DIR lets two builds of one checkout live side by side (parallel work); default "build".
  buildDirectory: process.env.BUILD_DIR ?? "build",
  ssr: true,
  future: {
    v8_middleware: true,
    v8_passThroughRequests: true,
    v8_splitRouteModules: true,
    v8_trailingSlashAwareDataRequests: true,
    v8_viteEnvironmentApi: true,
  },
} satisfies Config;
