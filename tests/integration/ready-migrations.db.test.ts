import {
  cpSync,
  mkdtempSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, expect, test } from "vitest";
import { runMigrations } from "~/.server/db/migrate";
import { closeDb } from "~/.server/db/client";
import { loader } from "~/routes/api/ready";
import { useDatabaseAt } from "../support/app-database";
import { createEmptyDatabase } from "../support/test-database";

/*
 * Readiness with a database one migration behind the build: migrated from a copy of drizzle/ whose journal
 * lacks the last entry, then made the app's database.
 */
const journal = JSON.parse(
  readFileSync("drizzle/meta/_journal.json", "utf8"),
) as { entries: { tag: string }[] };
const olderFolder = mkdtempSync(path.join(tmpdir(), "isopleth-migrations-"));
let behind: Awaited<ReturnType<typeof createEmptyDatabase>>;

beforeAll(async () => {
  cpSync("drizzle", olderFolder, { recursive: true });
  writeFileSync(
    path.join(olderFolder, "meta", "_journal.json"),
    JSON.stringify({ ...journal, entries: journal.entries.slice(0, -1) }),
  );
  behind = await createEmptyDatabase();
  await runMigrations(behind.url, olderFolder);
  useDatabaseAt(behind.url);
});
afterAll(async () => {
  await closeDb();
  await behind.drop();
  rmSync(olderFolder, { recursive: true, force: true });
});

test("GET /api/ready is 503 on a database missing the last migration, naming the check and the migration", async () => {
  const response = await loader();
  expect(response.status).toBe(503);
  const body = await response.json();
  expect(body.status).toBe("not ready");
  expect(body.failing).toContain("migrations");
  expect(body.checks.migrations).toEqual({
    ok: false,
    applied: journal.entries.length - 1,
    expected: journal.entries.length,
    pending: [journal.entries.at(-1)!.tag],
    problem: "the database is behind this build: run `npm run db:migrate`",
  });
});

test("once migrated, the same database is ready", async () => {
  await runMigrations(behind.url);
  const response = await loader();
  expect(response.status).toBe(200);
  expect((await response.json()).failing).toEqual([]);
});
