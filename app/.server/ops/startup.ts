import { sql } from "drizzle-orm";
import { getDb } from "~/.server/db/client";
import { describeError, logger } from "./logger";

/**
 * Run once before the server listens: tells the operator at once whether the database is reachable with the
 * configured credentials (a wrong password shows here, not as the first user's 503). The server starts either
 * way, answering 503 until the database answers.
 */
export async function checkDatabaseAtStartup(): Promise<boolean> {
  try {
    await getDb().execute(sql`SELECT 1`);
    logger.info("database reachable");
    return true;
  } catch (error) {
    const summary = describeError(error);
    const hint =
      summary.code === "ER_ACCESS_DENIED_ERROR"
        ? "the database refused the user or password in DATABASE_URL"
        : summary.code === "ER_BAD_DB_ERROR"
          ? "the database named in DATABASE_URL does not exist"
          : "the database in DATABASE_URL cannot be reached";
    logger.error(
      { error: summary },
      `database check at start-up failed: ${hint}; requests will be answered 503 until it answers`,
    );
    return false;
  }
}
