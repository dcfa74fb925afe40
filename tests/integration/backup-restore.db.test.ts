import { spawnSync } from "node:child_process";
import {
  mkdtempSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
} from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, expect, test } from "vitest";
import { runMigrations } from "~/.server/db/migrate";
import { createEmptyDatabase } from "../support/test-database";

/*
 * Backups that restore: `npm run backup` of a migrated, seeded database, then the data change, then
 * `npm run restore` into a fresh database must give back every table exactly as it was at backup time,
 * compared by row count and by MariaDB's CHECKSUM TABLE.
 */
const SECRETS =
  "SESSION_SECRET=backup-test-session-secret-aaaaaaaaaaaaaaaa\nAPI_TOKEN_SECRET=backup-test-api-secret-bbbbbbbbbbbbbbbbbbbb\n";
let source: Awaited<ReturnType<typeof createEmptyDatabase>>;
const dataDir = mkdtempSync(path.join(tmpdir(), "isopleth-backup-"));
const restoreDataDir = mkdtempSync(path.join(tmpdir(), "isopleth-restore-"));
const extraDatabases: string[] = [];

function run(
  script: "backup" | "restore",
  args: string[],
  env: Record<string, string>,
) {
  return spawnSync("bash", [`scripts/${script}.sh`, ...args], {
    env: { ...process.env, ...env },
    encoding: "utf8",
    timeout: 60_000,
  });
}

type TableState = Record<string, { rows: number; checksum: string }>;

async function tableState(url: string): Promise<TableState> {
  const connection = await mysql.createConnection({ uri: url });
  try {
    const [tables] = await connection.query<mysql.RowDataPacket[]>(
      "SHOW FULL TABLES WHERE Table_type = 'BASE TABLE'",
    );
    const state: TableState = {};
    for (const row of tables) {
      const name = String(Object.values(row)[0]);
      const [[count]] = await connection.query<mysql.RowDataPacket[]>(
        `SELECT COUNT(*) AS n FROM \`${name}\``,
      );
      const [[sum]] = await connection.query<mysql.RowDataPacket[]>(
        `CHECKSUM TABLE \`${name}\``,
      );
      state[name] = { rows: Number(count!.n), checksum: String(sum!.Checksum) };
    }
    return state;
  } finally {
    await connection.end();
  }
}

function urlOf(name: string) {
  const url = new URL(source.url);
  url.pathname = `/${name}`;
  return url.toString();
}

beforeAll(async () => {
  source = await createEmptyDatabase();
  await runMigrations(source.url);
  const seed = spawnSync("node_modules/.bin/tsx", ["scripts/seed.ts"], {
    env: { ...process.env, DATABASE_URL: source.url, NODE_ENV: "development" },
    encoding: "utf8",
  });
  if (seed.status !== 0) throw new Error(`seed failed: ${seed.stderr}`);
  writeFileSync(path.join(dataDir, "secrets.env"), SECRETS, { mode: 0o600 });
}, 60_000);

afterAll(async () => {
  const admin = await mysql.createConnection({ uri: source.url });
  for (const name of extraDatabases)
    await admin.query(`DROP DATABASE IF EXISTS \`${name}\``);
  await admin.end();
  await source.drop();
  rmSync(dataDir, { recursive: true, force: true });
  rmSync(restoreDataDir, { recursive: true, force: true });
});

test("back up, change the data, restore into a fresh database: every table's rows and checksum are as at backup time", async () => {
  const atBackup = await tableState(source.url);
  expect(Object.keys(atBackup)).toContain("__drizzle_migrations");
  expect(atBackup.users!.rows).toBeGreaterThan(0);

  const backup = run("backup", [], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: dataDir,
  });
  expect(backup.status, backup.stderr).toBe(0);
  const archive = backup.stdout.trim().split("\n").at(-1)!;
  expect(path.dirname(archive)).toBe(path.join(dataDir, "backups"));
  expect(path.basename(archive)).toMatch(
    new RegExp(`^isopleth-${source.name}-\\d{8}T\\d{6}Z\\.tar\\.gz$`),
  );
  expect(statSync(archive).mode & 0o777).toBe(0o600);
  expect(statSync(path.dirname(archive)).mode & 0o777).toBe(0o700);

  // the data change after the backup
  const connection = await mysql.createConnection({ uri: source.url });
  await connection.query("UPDATE users SET name = CONCAT(name, ' (changed)')");
  await connection.query("DELETE FROM ops_heartbeats");
  await connection.query(
    "INSERT INTO ops_heartbeats (instance, beat_at) VALUES ('after-backup', NOW(3))",
  );
  await connection.end();
  const changed = await tableState(source.url);
  expect(changed.users!.checksum).not.toBe(atBackup.users!.checksum);

  const fresh = `${source.name}_restored`;
  extraDatabases.push(fresh);
  const restore = run("restore", [archive, "--database", fresh], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: restoreDataDir,
  });
  expect(restore.status, restore.stderr).toBe(0);
  expect(await tableState(urlOf(fresh))).toEqual(atBackup);
  // the secrets came back too, owner-only
  const secrets = path.join(restoreDataDir, "secrets.env");
  expect(readFileSync(secrets, "utf8")).toBe(SECRETS);
  expect(statSync(secrets).mode & 0o777).toBe(0o600);

  // the configured database is not empty: refused without --force, and left as it was
  const refused = run("restore", [archive], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: restoreDataDir,
  });
  expect(refused.status).not.toBe(0);
  expect(refused.stderr).toMatch(
    new RegExp(
      `database ${source.name} is not empty \\(\\d+ tables\\); nothing restored.*--force`,
    ),
  );
  expect(await tableState(source.url)).toEqual(changed);

  // with --force it is replaced by the backup
  const forced = run("restore", [archive, "--force"], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: restoreDataDir,
  });
  expect(forced.status, forced.stderr).toBe(0);
  expect(await tableState(source.url)).toEqual(atBackup);
}, 90_000);

test("backup --output FILE writes there; restore refuses a file that is not a backup and an unknown option", () => {
  const target = path.join(dataDir, "elsewhere", "manual.tar.gz");
  const backup = run("backup", ["--output", target], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: dataDir,
  });
  expect(backup.status, backup.stderr).toBe(0);
  expect(statSync(target).mode & 0o777).toBe(0o600);
  const again = run("backup", ["--output", target], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: dataDir,
  });
  expect(again.status).not.toBe(0);
  expect(again.stderr).toContain("exists already; not overwriting it");

  const notBackup = path.join(dataDir, "not-a-backup.tar.gz");
  writeFileSync(notBackup, "plain text");
  const bad = run(
    "restore",
    [notBackup, "--database", `${source.name}_never`],
    { DATABASE_URL: source.url, ISOPLETH_DATA_DIR: restoreDataDir },
  );
  expect(bad.status).not.toBe(0);
  expect(bad.stderr).toContain("is not an Isopleth backup");
  const option = run("restore", [target, "--overwrite"], {
    DATABASE_URL: source.url,
    ISOPLETH_DATA_DIR: restoreDataDir,
  });
  expect(option.status).toBe(2);
  expect(option.stderr).toContain("unknown option: --overwrite");
});
