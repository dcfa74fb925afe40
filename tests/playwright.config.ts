import { defineConfig, devices } from "@playwright/test";

import { CHROMIUM_ARGS, CHROMIUM_PATH } from "./support/chromium";
import {
  APP_SERVER_ENV,
  APP_URL,
  SMTP_HTTP_PORT,
  SMTP_PORT,
} from "./support/e2e";

export default defineConfig({
  testDir: "./e2e",
  outputDir: "../test-results",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [["list"]],
  timeout: 60_000,
  use: {
    baseURL: APP_URL,
    trace: { mode: "retain-on-failure", screenshots: false, snapshots: true },
    screenshot: "only-on-failure",
  },
  projects: [
    {
      name: "debian-chromium",
      use: {
        ...devices["Desktop Chrome"],
        headless: true,
        launchOptions: {
          executablePath: CHROMIUM_PATH,
          args: CHROMIUM_ARGS,
        },
      },
    },
  ],
  webServer: [
    {
      command: `node_modules/.bin/tsx scripts/fake-smtp.ts ${SMTP_PORT} ${SMTP_HTTP_PORT}`,
      cwd: "..",
      url: `http://127.0.0.1:${SMTP_HTTP_PORT}/messages`,
      reuseExistingServer: false,
    },
    {
      command: "node scripts/server.mjs build/server/index.js",
      cwd: "..",
      url: `${APP_URL}/api/health`,
      reuseExistingServer: false,
      timeout: 60_000,
      env: APP_SERVER_ENV,
    },
  ],
});
