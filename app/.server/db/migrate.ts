import { drizzle } from "drizzle-orm/mysql2";
import { migrate } from "drizzle-orm/mysql2/migrator";
import mysql from "mysql2/promise";

/** Applies every migration in drizzle/ that the database has not seen yet. */
export async function runMigrations(databaseUrl: string, migrationsFolder = "drizzle"): Promise<void> {
  const connection = await mysql.createConnection({ uri: databaseUrl, multipleStatements: false, timezone: "Z" });
  try {
    await migrate(drizzle({ client: connection }), { migrationsFolder });
  } finally {
    await connection.end();
  }
}
