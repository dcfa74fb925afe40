import { readFileSync, statfsSync } from "node:fs";
import { tmpdir } from "node:os";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, expect, test } from "vitest";
import { parseEnv } from "~/.server/env";
import {
  checkReadiness,
  readinessOptions,
  type ReadinessOptions,
} from "~/.server/ops/readiness";
import { loader } from "~/routes/api/ready";
import { useFreshMigratedDatabase } from "../support/app-database";

/* Readiness (GET /api/ready) against a real MariaDB: a fresh migrated database for the file, the app's database. */
let fresh: Awaited<ReturnType<typeof useFreshMigratedDatabase>>;

beforeAll(async () => {
  fresh = await useFreshMigratedDatabase();
});
afterAll(async () => {
  await fresh.cleanup();
});

function options(overrides: Partial<ReadinessOptions> = {}) {
  return { ...readinessOptions(), ...overrides };
}

test("GET /api/ready is 200 with every check passing, and each call rewrites this host's heartbeat row", async () => {
  const response = await loader();
  expect(response.status).toBe(200);
  expect(response.headers.get("Cache-Control")).toBe("no-store");
  const body = await response.json();
  expect(body.status).toBe("ready");
  expect(body.failing).toEqual([]);
  expect(body.checks.database).toEqual({ ok: true });
  const journal = JSON.parse(
    readFileSync("drizzle/meta/_journal.json", "utf8"),
  ) as { entries: unknown[] };
  expect(body.checks.migrations).toEqual({
    ok: true,
    applied: journal.entries.length,
    expected: journal.entries.length,
    pending: [],
  });
  // the test database runs on this machine, so its data directory is watched beside the configured ones
  // (temp, and data when ISOPLETH_DATA_DIR is set, as npm test does for a shared server)
  expect(
    body.checks.disk.disks.map((d: { name: string }) => d.name).sort(),
  ).toEqual(
    [...readinessOptions().disks.map((d) => d.name), "database"].sort(),
  );

  const connection = await mysql.createConnection({ uri: fresh.url });
  try {
    const [[first]] = await connection.query<mysql.RowDataPacket[]>(
      "SELECT instance, beat_at FROM ops_heartbeats",
    );
    await new Promise((r) => setTimeout(r, 20));
    await loader();
    const [rows] = await connection.query<mysql.RowDataPacket[]>(
      "SELECT instance, beat_at FROM ops_heartbeats",
    );
    expect(rows).toHaveLength(1);
    expect(rows[0]!.beat_at.getTime()).toBeGreaterThan(
      first!.beat_at.getTime(),
    );
  } finally {
    await connection.end();
  }
});

test("the disk check passes with a tiny threshold and fails, named, when a disk has less free than required", async () => {
  const tiny = await checkReadiness(options({ minFreeBytes: 1 }));
  expect(tiny.checks.disk.ok).toBe(true);

  const stats = statfsSync(tmpdir());
  const moreThanFree = stats.bavail * stats.bsize + 1024 ** 3;
  const full = await checkReadiness(options({ minFreeBytes: moreThanFree }));
  expect(full.status).toBe("not ready");
  expect(full.failing).toEqual(["disk"]);
  expect(full.checks.disk.disks.find((d) => d.name === "temp")).toMatchObject({
    ok: false,
    problem: `less than ${moreThanFree} bytes free`,
  });
});

test("a watched folder that does not exist fails the disk check instead of passing unseen", async () => {
  const result = await checkReadiness(
    options({
      disks: [{ name: "data", path: "/nonexistent/isopleth-data" }],
    }),
  );
  expect(result.failing).toEqual(["disk"]);
  expect(result.checks.disk.disks[0]).toMatchObject({
    name: "data",
    ok: false,
    freeBytes: null,
  });
});

test("the configured minimum and data folder reach the check (READY_MIN_FREE_BYTES, ISOPLETH_DATA_DIR)", async () => {
  const env = parseEnv({
    NODE_ENV: "test",
    READY_MIN_FREE_BYTES: "12345",
    ISOPLETH_DATA_DIR: "/srv/isopleth",
  });
  const result = readinessOptions(env);
  expect(result.minFreeBytes).toBe(12345);
  expect(result.disks).toContainEqual({ name: "data", path: "/srv/isopleth" });
  expect(() => parseEnv({ READY_MIN_FREE_BYTES: "lots" })).toThrow(
    /READY_MIN_FREE_BYTES/,
  );
});

test("a database that does not take the write in time fails the database check, named", async () => {
  const locker = await mysql.createConnection({ uri: fresh.url });
  try {
    await locker.query("LOCK TABLES ops_heartbeats WRITE");
    const result = await checkReadiness(options({ timeoutMs: 500 }));
    expect(result.failing).toEqual(["database"]);
    expect(result.checks.database).toEqual({
      ok: false,
      problem: "the heartbeat write failed: no answer within 500 ms",
    });
  } finally {
    await locker.query("UNLOCK TABLES");
    await locker.end();
  }
});
