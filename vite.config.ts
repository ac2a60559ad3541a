import { fileURLToPath } from "node:url";
import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { defineConfig } from "vite";

export default defineConfig({
  plugins: [tailwindcss(), reactRouter()],
  resolve: {
    alias: { "~": fileURLToPath(new URL("./app", import.meta.url)) },
  },
  server: { host: "127.0.0.1" },
  // Plotly is one large chunk, loaded lazily in the browser by the pages with plots only.
  build: { chunkSizeWarningLimit: 5000 },
});
