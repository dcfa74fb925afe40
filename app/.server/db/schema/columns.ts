import { sql } from "drizzle-orm";
import { bigint, timestamp } from "drizzle-orm/mysql-core";

/** Auto-increment primary key shared by most tables. */
export const id = () =>
  bigint("id", { mode: "number", unsigned: true }).autoincrement().primaryKey();

/** Foreign key column matching `id()`. */
export const ref = (name: string) =>
  bigint(name, { mode: "number", unsigned: true });

export const createdAt = () =>
  timestamp("created_at", { fsp: 3, mode: "date" })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`);

export const updatedAt = () =>
  timestamp("updated_at", { fsp: 3, mode: "date" })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`)
    .onUpdateNow();
