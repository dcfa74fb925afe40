import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { createWriteStream } from "node:fs";
import { expect } from "@playwright/test";
import { APP_SERVER_ENV } from "./e2e";
import { createEmptyDatabase } from "./test-database";

/** The production server command (package.json "serve"), for specs that start servers of their own. */
export const SERVER_ARGS = ["scripts/server.mjs", "build/server/index.js"];

/** A throwaway database, migrated and seeded with the invented demo data, for a spec that writes at random. */
export async function createSeededDatabase() {
  const database = await createEmptyDatabase();
  const env = { ...process.env, DATABASE_URL: database.url };
  execFileSync("node_modules/.bin/tsx", ["scripts/migrate.ts"], {
    env,
    stdio: "ignore",
  });
  execFileSync("node_modules/.bin/tsx", ["scripts/seed.ts"], {
    env,
    stdio: "ignore",
  });
  return database;
}

/** Starts the production server on `port` with the e2e environment plus `env`; stderr is passed through. */
export function startAppServer(
  port: number,
  env: Record<string, string>,
  stdout: "ignore" | "pipe" = "ignore",
): ChildProcess {
  const child = spawn("node", SERVER_ARGS, {
    env: {
      ...process.env,
      ...APP_SERVER_ENV,
      PORT: String(port),
      APP_BASE_URL: `http://127.0.0.1:${port}`,
      LOG_LEVEL: "warn",
      ...env,
    },
    stdio: ["ignore", stdout, "pipe"],
  });
  child.stderr?.on("data", (d) =>
    process.stderr.write(`[server ${port}] ${d}`),
  );
  // SERVER_LOG_DIR=… keeps each server's JSON log lines, e.g. to see which routes a fuzz run spends its time on.
  if (stdout === "pipe" && process.env.SERVER_LOG_DIR)
    child.stdout?.pipe(
      createWriteStream(`${process.env.SERVER_LOG_DIR}/server-${port}.log`),
    );
  return child;
}

export async function waitForHealth(port: number, status = 200) {
  await expect
    .poll(
      async () =>
        (await fetch(`http://127.0.0.1:${port}/api/health`).catch(() => null))
          ?.status ?? 0,
      { timeout: 30_000 },
    )
    .toBe(status);
}
