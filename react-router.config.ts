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
  // The computation pool's worker threads load a file of their own: compile it beside the server
  // bundle (app/services/api/pool.server.ts looks for it there).
  async buildEnd({ reactRouterConfig, viteConfig }) {
    const { buildComputeWorker } = await import("./scripts/build-worker");
    await buildComputeWorker(viteConfig.root, `${reactRouterConfig.buildDirectory}/server`);
  },
} satisfies Config;
