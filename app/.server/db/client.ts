import { drizzle, type MySql2Database } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { getEnv } from "~/.server/env";
import * as schema from "./schema";

export type Database = MySql2Database<typeof schema>;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** A query function accepts the database or a transaction, so several can share one transaction. */
export type Executor = Database | Transaction;

let pool: mysql.Pool | undefined;
let database: Database | undefined;

export function createPool(url: string, connectionLimit: number): mysql.Pool {
  return mysql.createPool({
    uri: url,
    connectionLimit,
    timezone: "Z",
    dateStrings: ["DATE"],
    connectTimeout: 3_000,
  });
}

/** The application's single database handle (react-router-serve has no load context to carry it). */
export function getDb(): Database {
  if (!database) {
    const env = getEnv();
    pool = createPool(env.DATABASE_URL, env.DATABASE_POOL_SIZE);
    database = drizzle({ client: pool, schema, mode: "default" });
    // react-router-serve stops accepting requests on these signals; the open pool would keep the process alive.
    for (const signal of ["SIGINT", "SIGTERM"] as const) process.once(signal, () => void closeDb());
  }
  return database;
}

export async function closeDb(): Promise<void> {
  const p = pool;
  pool = undefined;
  database = undefined;
  await p?.end();
}
