// Compiles the heavy-work worker (app/.server/workers/heavy-worker.ts) to build/server/heavy-worker.js, beside
// the server bundle, which finds it at run time as new URL("./heavy-worker.js", import.meta.url). Runs after
// `react-router build` (npm run build).
//
// A separate build because the React Router plugin owns the SSR environment's output: a second entry in
// environments.ssr.build.rollupOptions.input is emitted, but the plugin forces entryFileNames to "index.js",
// so it comes out as an unstable "index2.js" and the server bundle is split into shared chunks.
// The worker imports only app/core; packages stay external (resolved from node_modules, as for index.js).
import { build } from "vite";

await build({
  configFile: false,
  logLevel: "warn",
  resolve: { tsconfigPaths: true },
  build: {
    ssr: "app/.server/workers/heavy-worker.ts",
    outDir: "build/server",
    emptyOutDir: false,
    copyPublicDir: false,
    minify: false,
    rolldownOptions: {
      output: { format: "esm", entryFileNames: "heavy-worker.js" },
      checks: { pluginTimings: false },
    },
  },
});
console.log("built build/server/heavy-worker.js");
