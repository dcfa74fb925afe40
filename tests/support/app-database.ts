import {
  closeDb,
  createDatabase,
  provideDatabase,
  type Database,
} from "~/.server/db/client";
import { runMigrations } from "~/.server/db/migrate";
import { createEmptyDatabase } from "./test-database";

/*
 * Database tests hand the app its database as a handle: query functions take it as `db`, and code that reads
 * getDb() (services, routes) gets the same one through provideDatabase. Nothing is passed through process.env,
 * so app modules are imported statically. (Kept apart from test-database.ts, which Playwright loads too.)
 */

/**
 * A fresh, migrated database for the test file, made the app's database and returned as `db`; cleanup closes
 * it and drops it.
 */
export async function useFreshMigratedDatabase(): Promise<{
  url: string;
  db: Database;
  cleanup: () => Promise<void>;
}> {
  const database = await createEmptyDatabase();
  await runMigrations(database.url);
  return {
    ...useDatabaseAt(database.url),
    cleanup: async () => {
      await closeDb();
      await database.drop();
    },
  };
}

/** Makes the database at `url` the app's (no migrations run); closeDb() closes it. */
export function useDatabaseAt(url: string): { url: string; db: Database } {
  const handle = createDatabase(url);
  provideDatabase(handle);
  return { url, db: handle.db };
}
