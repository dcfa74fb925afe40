import { mysqlTable, varchar } from "drizzle-orm/mysql-core";
import { users } from "./auth";
import { ref, updatedAt } from "./columns";

/**
 * Installation-wide settings an administrator chooses (lab policies), one row per key. A key without a row has
 * its default; values are checked with zod where they are read (app/.server/db/queries/settings.ts).
 */
export const labSettings = mysqlTable("lab_settings", {
  key: varchar("key", { length: 64 }).primaryKey(),
  value: varchar("value", { length: 255 }).notNull(),
  updatedBy: ref("updated_by").references(() => users.id, {
    onDelete: "set null",
  }),
  updatedAt: updatedAt(),
});

export type LabSetting = typeof labSettings.$inferSelect;
