/**
 * Compiles the computation pool's worker entry (app/services/api/compute.worker.ts) into
 * `<outDir>/compute-worker.js`, an ES module beside the server bundle; packages stay imports from
 * node_modules, as in the server bundle. Run by react-router.config.ts at the end of every build.
 */
import { fileURLToPath } from "node:url";
import { build } from "vite";

export async function buildComputeWorker(root: string, outDir: string): Promise<void> {
  await build({
    configFile: false,
    root,
    logLevel: "warn",
    resolve: { alias: { "~": fileURLToPath(new URL("../app", import.meta.url)) } },
    build: {
      ssr: "app/services/api/compute.worker.ts",
      outDir,
      emptyOutDir: false,
      copyPublicDir: false,
      minify: false,
      rollupOptions: { output: { format: "es", entryFileNames: "compute-worker.js" } },
    },
  });
}
