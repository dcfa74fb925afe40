import { drizzle, type MySql2Database } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { getEnv } from "~/.server/env";
import { gaugeFrom } from "~/.server/ops/metrics";
import { currentRequest } from "~/.server/ops/request-store";
import * as schema from "./schema";

export type Database = MySql2Database<typeof schema>;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** A query function accepts the database or a transaction, so several can share one transaction. */
export type Executor = Database | Transaction;

type PoolBounds = {
  connectionLimit: number;
  /** ms a single query may run before it fails (the connection is then discarded). */
  queryTimeoutMs: number;
  /** ms a caller may wait for a pooled connection. */
  acquireTimeoutMs: number;
  /** callers that may wait for a connection at once. */
  queueLimit: number;
};

let pool: mysql.Pool | undefined;
let database: Database | undefined;

/**
 * Error codes meaning "the database could not be reached or answered in time", as opposed to a query that was
 * refused (a constraint, a syntax error). A request that meets one is answered 503 with Retry-After.
 */
const UNAVAILABLE_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EPIPE",
  "EHOSTUNREACH",
  "PROTOCOL_CONNECTION_LOST",
  "PROTOCOL_SEQUENCE_TIMEOUT",
  "PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR",
  "ER_ACCESS_DENIED_ERROR",
  "ER_CON_COUNT_ERROR",
  "ER_SERVER_SHUTDOWN",
  "ER_BAD_DB_ERROR",
  "POOL_ACQUIRE_TIMEOUT",
  "POOL_QUEUE_FULL",
  "POOL_CLOSED",
]);

export function isDatabaseUnavailable(error: unknown): boolean {
  for (
    let e: unknown = error, depth = 0;
    e instanceof Error && depth < 4;
    e = e.cause, depth++
  ) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string" && UNAVAILABLE_CODES.has(code)) return true;
    if (/^(Queue limit reached|Pool is closed)/.test(e.message)) return true;
  }
  return false;
}

function coded(message: string, code: string): Error {
  return Object.assign(new Error(message), { code });
}

/** Marks the current request as having met an unreachable database, then rethrows. */
function note(error: unknown): never {
  if (isDatabaseUnavailable(error)) {
    const state = currentRequest();
    if (state) state.databaseUnavailable = true;
  }
  throw error;
}

type Queryable = Pick<mysql.Pool, "query" | "execute">;
const BOUNDED = Symbol("bounded");

/** Every query through `target` carries mysql2's client-side `timeout`, so a frozen server cannot hold it. */
function boundQueries<T extends Queryable>(target: T, timeoutMs: number): T {
  const t = target as T & { [BOUNDED]?: true };
  if (t[BOUNDED]) return target;
  for (const method of ["query", "execute"] as const) {
    const original = target[method].bind(target) as (
      ...args: unknown[]
    ) => Promise<unknown>;
    (t as unknown as Record<string, unknown>)[method] = (
      first: unknown,
      ...rest: unknown[]
    ) => {
      const options =
        typeof first === "string"
          ? { sql: first, timeout: timeoutMs }
          : { timeout: timeoutMs, ...(first as object) };
      return original(options, ...rest).catch(note);
    };
  }
  t[BOUNDED] = true;
  return target;
}

/**
 * A mysql2 pool whose every wait is bounded: connecting (connectTimeout), waiting for a pooled connection
 * (acquireTimeoutMs, then POOL_ACQUIRE_TIMEOUT), the queue of waiters (queueLimit, then POOL_QUEUE_FULL) and each
 * query (queryTimeoutMs, mysql2's own timeout, which discards the connection). The server also stops a statement
 * that runs past the same bound (max_statement_time), so an abandoned query does not run on.
 */
function createPool(url: string, bounds: PoolBounds | number): mysql.Pool {
  const b: PoolBounds =
    typeof bounds === "number"
      ? {
          connectionLimit: bounds,
          queryTimeoutMs: 30_000,
          acquireTimeoutMs: 10_000,
          queueLimit: 1_000,
        }
      : bounds;
  const created = mysql.createPool({
    uri: url,
    connectionLimit: b.connectionLimit,
    queueLimit: 0,
    timezone: "Z",
    dateStrings: ["DATE"],
    connectTimeout: Math.min(b.acquireTimeoutMs, 10_000),
  });
  created.pool.on("connection", (connection) => {
    connection.query(
      `SET SESSION max_statement_time = ${(b.queryTimeoutMs / 1000).toFixed(3)}`,
      () => {},
    );
  });
  boundQueries(created, b.queryTimeoutMs);
  let waiting = 0;
  const getConnection = created.getConnection.bind(created);
  created.getConnection = async () => {
    if (waiting >= b.queueLimit)
      note(
        coded(
          `more than ${b.queueLimit} requests are waiting for the database`,
          "POOL_QUEUE_FULL",
        ),
      );
    waiting++;
    let timer: NodeJS.Timeout | undefined;
    const acquiring = getConnection();
    try {
      const connection = await Promise.race([
        acquiring,
        new Promise<never>((_, reject) => {
          timer = setTimeout(
            () =>
              reject(
                coded(
                  `no database connection within ${b.acquireTimeoutMs} ms`,
                  "POOL_ACQUIRE_TIMEOUT",
                ),
              ),
            b.acquireTimeoutMs,
          );
        }),
      ]);
      return boundQueries(connection, b.queryTimeoutMs);
    } catch (error) {
      // A connection that arrives after the caller gave up goes straight back to the pool.
      acquiring.then((late) => late.release()).catch(() => {});
      return note(error);
    } finally {
      waiting--;
      clearTimeout(timer);
    }
  };
  return created;
}

/** A database handle over a pool of its own: the drizzle instance and how to close its pool. */
type DatabaseHandle = { db: Database; close: () => Promise<void> };

/** Opens a handle on `url` (scripts and tests; the application's own comes from getDb()). */
export function createDatabase(
  url: string,
  bounds: PoolBounds | number = 5,
): DatabaseHandle {
  const created = createPool(url, bounds);
  return {
    db: drizzle({ client: created, schema, mode: "default" }),
    close: () => created.end(),
  };
}

let provided: DatabaseHandle | undefined;

/**
 * Makes `handle` the application's database until closeDb(), so code that reads getDb() (services, routes)
 * works on it: an integration test hands the app its own fresh database this way, without touching the
 * environment. Query functions also take the handle directly (`db`).
 */
export function provideDatabase(handle: DatabaseHandle): void {
  if (database) throw new Error("the application's database is already open");
  provided = handle;
  database = handle.db;
}

/** The application's single database handle. The HTTP server closes it on shutdown (`closeDb`). */
export function getDb(): Database {
  if (!database) {
    const env = getEnv();
    pool = createPool(env.DATABASE_URL, {
      connectionLimit: env.DATABASE_POOL_SIZE,
      queryTimeoutMs: env.DATABASE_QUERY_TIMEOUT_MS,
      acquireTimeoutMs: env.DATABASE_ACQUIRE_TIMEOUT_MS,
      queueLimit: env.DATABASE_QUEUE_LIMIT,
    });
    database = drizzle({ client: pool, schema, mode: "default" });
    const inner = pool.pool as unknown as {
      _allConnections: { length: number };
      _freeConnections: { length: number };
    };
    gaugeFrom(
      "isopleth_db_pool_connections",
      "Database pool connections by state.",
      () => ({
        open: inner._allConnections.length,
        idle: inner._freeConnections.length,
        busy: inner._allConnections.length - inner._freeConnections.length,
      }),
      "state",
    );
  }
  return database;
}

export async function closeDb(): Promise<void> {
  const p = pool;
  const handle = provided;
  pool = undefined;
  provided = undefined;
  database = undefined;
  await p?.end();
  await handle?.close();
}
