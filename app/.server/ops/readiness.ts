import { readFile, statfs } from "node:fs/promises";
import { hostname, tmpdir } from "node:os";
import path from "node:path";
import {
  getAppliedMigrations,
  getDatabaseDataDir,
  updateHeartbeat,
  withTimeout,
} from "~/.server/db/queries/health";
import { getEnv, type Env } from "~/.server/env";

/*
 * Readiness (GET /api/ready): can this instance take traffic? Unlike liveness (GET /api/health, a SELECT 1),
 * it checks what a request needs: the database accepts a write, the schema is the one this build expects, and
 * the disks the data and the uploads live on have room. Each check answers within `timeoutMs`.
 */

type CheckName = "database" | "migrations" | "disk";

type DiskReport = {
  name: string;
  ok: boolean;
  freeBytes: number | null;
  problem?: string;
};

type Readiness = {
  status: "ready" | "not ready";
  failing: CheckName[];
  checks: {
    database: { ok: boolean; problem?: string };
    migrations: {
      ok: boolean;
      applied: number;
      expected: number;
      pending: string[];
      problem?: string;
    };
    disk: { ok: boolean; minFreeBytes: number; disks: DiskReport[] };
  };
};

export type ReadinessOptions = {
  /** Each watched disk must have at least this much free for an unprivileged process (statfs bavail). */
  minFreeBytes: number;
  /** Named paths whose file systems are watched; the database's own @@datadir is added when it is local. */
  disks: { name: string; path: string }[];
  /** Also watch the database server's data directory (only meaningful when it runs on this machine). */
  databaseIsLocal: boolean;
  migrationsFolder: string;
  timeoutMs: number;
};

const LOOPBACK = new Set(["127.0.0.1", "localhost", "::1", "[::1]"]);

/** The options of the readiness route, from the configuration. */
export function readinessOptions(env: Env = getEnv()): ReadinessOptions {
  const disks = [{ name: "temp", path: tmpdir() }];
  if (env.ISOPLETH_DATA_DIR)
    disks.unshift({ name: "data", path: env.ISOPLETH_DATA_DIR });
  return {
    minFreeBytes: env.READY_MIN_FREE_BYTES,
    disks,
    databaseIsLocal: LOOPBACK.has(new URL(env.DATABASE_URL).hostname),
    migrationsFolder: path.resolve("drizzle"),
    timeoutMs: 2_000,
  };
}

export async function checkReadiness(
  options: ReadinessOptions = readinessOptions(),
): Promise<Readiness> {
  const [database, migrations, disk] = await Promise.all([
    checkDatabaseWrite(options.timeoutMs),
    checkMigrations(options.migrationsFolder, options.timeoutMs),
    checkDisks(options),
  ]);
  const checks = { database, migrations, disk };
  const failing = (Object.keys(checks) as CheckName[]).filter(
    (name) => !checks[name].ok,
  );
  return {
    status: failing.length === 0 ? "ready" : "not ready",
    failing,
    checks,
  };
}

async function checkDatabaseWrite(
  timeoutMs: number,
): Promise<Readiness["checks"]["database"]> {
  return withTimeout(
    updateHeartbeat(hostname()).then(() => ({ ok: true })),
    timeoutMs,
    (error) => ({
      ok: false,
      problem: `the heartbeat write failed: ${describe(error)}`,
    }),
  );
}

type Journal = { entries: { tag: string; when: number }[] };

async function checkMigrations(
  folder: string,
  timeoutMs: number,
): Promise<Readiness["checks"]["migrations"]> {
  let journal: Journal;
  try {
    journal = JSON.parse(
      await readFile(path.join(folder, "meta", "_journal.json"), "utf8"),
    ) as Journal;
  } catch (error) {
    return {
      ok: false,
      applied: 0,
      expected: 0,
      pending: [],
      problem: `cannot read the migration journal: ${describe(error)}`,
    };
  }
  const expected = journal.entries.length;
  return withTimeout(
    getAppliedMigrations().then(({ count, lastWhenMs }) => {
      // The same rule as drizzle's migrator: an entry newer than the newest applied one is still to run.
      const pending = journal.entries
        .filter((e) => lastWhenMs === null || e.when > lastWhenMs)
        .map((e) => e.tag);
      const ok = pending.length === 0 && count >= expected;
      return {
        ok,
        applied: count,
        expected,
        pending,
        ...(ok
          ? {}
          : {
              problem:
                "the database is behind this build: run `npm run db:migrate`",
            }),
      };
    }),
    timeoutMs,
    (error) => ({
      ok: false,
      applied: 0,
      expected,
      pending: [],
      problem: `cannot read the applied migrations: ${describe(error)}`,
    }),
  );
}

async function checkDisks(
  options: ReadinessOptions,
): Promise<Readiness["checks"]["disk"]> {
  const disks = [...options.disks];
  if (options.databaseIsLocal) {
    const datadir = await withTimeout(
      getDatabaseDataDir(),
      options.timeoutMs,
      () => null,
    );
    if (datadir) disks.push({ name: "database", path: datadir });
  }
  const reports = await Promise.all(
    disks.map(async ({ name, path: where }): Promise<DiskReport> => {
      try {
        const stats = await statfs(where);
        const freeBytes = stats.bavail * stats.bsize;
        return freeBytes >= options.minFreeBytes
          ? { name, ok: true, freeBytes }
          : {
              name,
              ok: false,
              freeBytes,
              problem: `less than ${options.minFreeBytes} bytes free`,
            };
      } catch (error) {
        return {
          name,
          ok: false,
          freeBytes: null,
          problem: `cannot inspect its file system: ${describe(error)}`,
        };
      }
    }),
  );
  return {
    ok: reports.every((r) => r.ok),
    minFreeBytes: options.minFreeBytes,
    disks: reports,
  };
}

function describe(error: unknown): string {
  // Drizzle wraps driver errors ("Failed query: ..."); the driver's message is the useful part.
  let e: unknown = error;
  while (
    e &&
    typeof e === "object" &&
    "cause" in e &&
    (e as { cause?: unknown }).cause
  )
    e = (e as { cause: unknown }).cause;
  return e instanceof Error ? e.message : String(e);
}
