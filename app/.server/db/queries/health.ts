import { sql } from "drizzle-orm";
import { getDb } from "../client";

/** True when the database answers a trivial query within `timeoutMs`. */
export async function pingDatabase(timeoutMs = 2_000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  const ping = getDb()
    .execute(sql`SELECT 1`)
    .then(() => true as const)
    .catch(() => false as const);
  try {
    return await Promise.race([ping, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
