import { reactRouter } from "@react-router/dev/vite";
import tailwindcss from "@tailwindcss/vite";
import { defineConfig } from "vitest/config";

const testEnv = {
  // Vitest never runs the React Router plugin; tests import modules directly.
  NODE_ENV: "test",
};

export default defineConfig({
  resolve: { tsconfigPaths: true },
  plugins: process.env.VITEST ? [] : [tailwindcss(), reactRouter()],
  optimizeDeps: {
    include: ["plotly.js-gl3d-dist-min", "react-plotly.js/factory"],
  },
  build: {
    chunkSizeWarningLimit: 5000,
    rolldownOptions: { checks: { pluginTimings: false } },
  },
  test: {
    environment: "node",
    env: testEnv,
    setupFiles: ["tests/setup/vitest.setup.ts"],
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: ["app/**/*.test.ts", "tests/unit/**/*.test.ts"],
          exclude: ["**/*.db.test.ts", "node_modules/**"],
        },
      },
      {
        extends: true,
        test: {
          name: "db",
          // Every database test lives in tests/integration.
          include: ["tests/integration/**/*.db.test.ts"],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 30_000,
        },
      },
    ],
  },
});
