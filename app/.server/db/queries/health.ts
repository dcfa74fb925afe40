import { sql } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { opsHeartbeats } from "../schema";

/** Resolves `work`, or `fallback` when `work` rejects or takes longer than `timeoutMs`. */
export async function withTimeout<T>(
  work: Promise<T>,
  timeoutMs: number,
  fallback: (reason: unknown) => T,
): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<T>((resolve) => {
    timer = setTimeout(
      () => resolve(fallback(new Error(`no answer within ${timeoutMs} ms`))),
      timeoutMs,
    );
  });
  try {
    return await Promise.race([
      work.catch((error: unknown) => fallback(error)),
      timeout,
    ]);
  } finally {
    clearTimeout(timer);
  }
}

/** True when the database answers a trivial query within `timeoutMs` (liveness: GET /api/health). */
export async function pingDatabase(timeoutMs = 2_000): Promise<boolean> {
  const ping = getDb()
    .execute(sql`SELECT 1`)
    .then(() => true);
  return withTimeout(ping, timeoutMs, () => false);
}

/** The tiny real write of the readiness check: upserts this instance's heartbeat row. */
export async function updateHeartbeat(
  instance: string,
  db: Executor = getDb(),
): Promise<void> {
  await db
    .insert(opsHeartbeats)
    .values({ instance, beatAt: sql`CURRENT_TIMESTAMP(3)` })
    .onDuplicateKeyUpdate({ set: { beatAt: sql`CURRENT_TIMESTAMP(3)` } });
}

/**
 * What drizzle's migrator has recorded: how many migrations, and the `when` of the newest
 * (the migrator applies every journal entry newer than that). No table yet: nothing applied.
 */
export async function getAppliedMigrations(
  db: Executor = getDb(),
): Promise<{ count: number; lastWhenMs: number | null }> {
  try {
    const [rows] = (await db.execute(
      sql`SELECT COUNT(*) AS count, MAX(created_at) AS last FROM __drizzle_migrations`,
    )) as unknown as [
      { count: number | string; last: number | string | null }[],
    ];
    const row = rows[0];
    return {
      count: Number(row?.count ?? 0),
      lastWhenMs: row?.last == null ? null : Number(row.last),
    };
  } catch (error) {
    if (hasCode(error, "ER_NO_SUCH_TABLE"))
      return { count: 0, lastWhenMs: null };
    throw error;
  }
}

/** The database server's data directory (@@datadir), as the server reports it. */
export async function getDatabaseDataDir(
  db: Executor = getDb(),
): Promise<string> {
  const [rows] = (await db.execute(
    sql`SELECT @@datadir AS datadir`,
  )) as unknown as [{ datadir: string }[]];
  return rows[0]!.datadir;
}

function hasCode(error: unknown, code: string): boolean {
  for (
    let e: unknown = error;
    e && typeof e === "object";
    e = (e as { cause?: unknown }).cause
  ) {
    if ((e as { code?: unknown }).code === code) return true;
  }
  return false;
}
