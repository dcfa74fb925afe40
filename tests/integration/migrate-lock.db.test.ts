import { readFileSync } from "node:fs";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, expect, test } from "vitest";
import { migrationLockName, runMigrations } from "~/.server/db/migrate";
import { createEmptyDatabase } from "../support/test-database";

/*
 * Migrations under a lock: several migrators started together on one empty database (two app instances, or
 * `npm run db:migrate` twice) must all succeed and apply the schema once. Without the lock each of them reads
 * "nothing applied yet" and runs 0000_init, and all but one fail with "Table ... already exists".
 */
const journal = JSON.parse(
  readFileSync("drizzle/meta/_journal.json", "utf8"),
) as { entries: { tag: string }[] };
let database: Awaited<ReturnType<typeof createEmptyDatabase>>;

beforeAll(async () => {
  database = await createEmptyDatabase();
});
afterAll(async () => {
  await database.drop();
});

test("six concurrent runMigrations on one empty database all succeed and apply each migration once", async () => {
  const results = await Promise.allSettled(
    Array.from({ length: 6 }, () => runMigrations(database.url)),
  );
  const failures = results.flatMap((r) =>
    r.status === "rejected" ? [String(r.reason)] : [],
  );
  expect(failures).toEqual([]);

  const connection = await mysql.createConnection({ uri: database.url });
  try {
    const [applied] = await connection.query<mysql.RowDataPacket[]>(
      "SELECT hash FROM __drizzle_migrations",
    );
    expect(applied).toHaveLength(journal.entries.length);
    expect(new Set(applied.map((r) => r.hash)).size).toBe(
      journal.entries.length,
    );
    const [tables] = await connection.query<mysql.RowDataPacket[]>(
      "SHOW TABLES LIKE 'users'",
    );
    expect(tables).toHaveLength(1);
  } finally {
    await connection.end();
  }
});

test("a migrator that cannot get the lock in time says so and changes nothing", async () => {
  const empty = await createEmptyDatabase();
  const holder = await mysql.createConnection({ uri: empty.url });
  try {
    await holder.query("SELECT GET_LOCK(?, 1)", [
      migrationLockName(empty.name),
    ]);
    await expect(runMigrations(empty.url, "drizzle", 1)).rejects.toThrow(
      /held the migration lock for more than 1 s/,
    );
    const [tables] = await holder.query<mysql.RowDataPacket[]>("SHOW TABLES");
    expect(tables).toEqual([]);
  } finally {
    await holder.end();
    await empty.drop();
  }
});
