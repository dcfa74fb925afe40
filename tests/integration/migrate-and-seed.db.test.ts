import { drizzle } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, expect, test } from "vitest";
import { runMigrations } from "~/.server/db/migrate";
import * as schema from "~/.server/db/schema";
import {
  DEMO_SAMPLES,
  DEMO_USERS,
  DEMO_WELLS,
  seedDemo,
} from "~/.server/db/seed";
import { createEmptyDatabase } from "../support/test-database";

let database: Awaited<ReturnType<typeof createEmptyDatabase>>;
let pool: mysql.Pool;

beforeAll(async () => {
  database = await createEmptyDatabase();
  pool = mysql.createPool({ uri: database.url, timezone: "Z" });
});

afterAll(async () => {
  await pool?.end();
  await database?.drop();
});

async function tableCounts() {
  const [rows] = await pool.query(
    `SELECT (SELECT COUNT(*) FROM users) AS users, (SELECT COUNT(*) FROM fields) AS fields,
            (SELECT COUNT(*) FROM wells) AS wells, (SELECT COUNT(*) FROM samples) AS samples,
            (SELECT COUNT(*) FROM sample_revisions) AS revisions, (SELECT COUNT(*) FROM property_grids) AS grids,
            (SELECT COUNT(*) FROM grid_points) AS points`,
  );
  return (rows as Record<string, number>[])[0];
}

test("every committed migration applies to an empty database, and applying again changes nothing", async () => {
  const [before] = await pool.query("SHOW TABLES");
  expect(before).toEqual([]);

  await runMigrations(database.url);
  const [tables] = await pool.query("SHOW TABLES");
  const names = (tables as Record<string, string>[])
    .map((r) => Object.values(r)[0])
    .sort();
  for (const expected of [
    "api_tokens",
    "audit_log",
    "fields",
    "grid_points",
    "property_grids",
    "revision_bubble_points",
    "sample_revisions",
    "samples",
    "sessions",
    "users",
    "wells",
  ]) {
    expect(names).toContain(expected);
  }
  const [applied] = await pool.query(
    "SELECT COUNT(*) AS n FROM __drizzle_migrations",
  );
  await runMigrations(database.url);
  const [again] = await pool.query(
    "SELECT COUNT(*) AS n FROM __drizzle_migrations",
  );
  expect(again).toEqual(applied);

  // Measured values are IEEE doubles, not decimals or floats.
  const [columns] = await pool.query(
    "SELECT DATA_TYPE AS t FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'grid_points' AND COLUMN_NAME = 'value'",
  );
  expect(columns).toEqual([{ t: "double" }]);
});

test("the server runs in UTC with utf8mb4, so timestamps and names round-trip", async () => {
  const [rows] = await pool.query(
    "SELECT @@time_zone AS tz, @@character_set_database AS cs",
  );
  expect(rows).toEqual([{ tz: "+00:00", cs: "utf8mb4" }]);
});

test("the demo seed loads the invented scenario and is idempotent", async () => {
  const db = drizzle({ client: pool, schema, mode: "default" });
  await seedDemo(db, { demoPassword: "demo-password-for-tests" });
  const first = await tableCounts();
  const expectedPoints = DEMO_SAMPLES.reduce(
    (n, s) => n + 7 * s.pressuresPsia.length * s.temperaturesF.length,
    0,
  );
  expect(first).toEqual({
    users: DEMO_USERS.length,
    fields: 1,
    wells: DEMO_WELLS.length,
    samples: DEMO_SAMPLES.length,
    revisions: DEMO_SAMPLES.length,
    grids: 7 * DEMO_SAMPLES.length,
    points: expectedPoints,
  });

  await seedDemo(db, { demoPassword: "demo-password-for-tests" });
  expect(await tableCounts()).toEqual(first);

  const [fieldRows] = await pool.query("SELECT description FROM fields");
  expect((fieldRows as { description: string }[])[0]?.description).toMatch(
    /invented/i,
  );
  // Grids look like laboratory data: 8–15 pressures, several temperatures, a bubble point per temperature.
  for (const s of DEMO_SAMPLES) {
    expect(s.pressuresPsia.length).toBeGreaterThanOrEqual(8);
    expect(s.pressuresPsia.length).toBeLessThanOrEqual(15);
    expect(s.temperaturesF.length).toBeGreaterThanOrEqual(3);
  }
  const [bubble] = await pool.query(
    "SELECT COUNT(*) AS n FROM revision_bubble_points",
  );
  expect((bubble as { n: number }[])[0]?.n).toBe(
    DEMO_SAMPLES.reduce((n, s) => n + s.temperaturesF.length, 0),
  );
  const [hashes] = await pool.query("SELECT password_hash AS h FROM users");
  for (const row of hashes as { h: string }[])
    expect(row.h).toMatch(/^\$argon2id\$/);
});
