import { mysqlTable, timestamp, varchar } from "drizzle-orm/mysql-core";

/**
 * One row per app host, rewritten by every readiness check (GET /api/ready): the tiny real write that proves the
 * database accepts writes, not only reads.
 */
export const opsHeartbeats = mysqlTable("ops_heartbeats", {
  instance: varchar("instance", { length: 255 }).primaryKey(),
  beatAt: timestamp("beat_at", { fsp: 3, mode: "date" }).notNull(),
});

export type OpsHeartbeat = typeof opsHeartbeats.$inferSelect;
export type NewOpsHeartbeat = typeof opsHeartbeats.$inferInsert;
