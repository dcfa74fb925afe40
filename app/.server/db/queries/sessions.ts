import { eq } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { sessions, users } from "../schema";

export async function insertSession(
  row: {
    id: string;
    userId: number;
    expiresAt: Date;
    ipAddress: string | null;
    userAgent: string | null;
  },
  db: Executor = getDb(),
) {
  await db.insert(sessions).values(row);
}

export async function getSessionWithUser(id: string, db: Executor = getDb()) {
  const [row] = await db
    .select({
      sessionId: sessions.id,
      expiresAt: sessions.expiresAt,
      user: {
        id: users.id,
        email: users.email,
        name: users.name,
        role: users.role,
        unitSystem: users.unitSystem,
        disabledAt: users.disabledAt,
      },
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.id, id));
  return row ?? null;
}

export async function extendSession(
  id: string,
  expiresAt: Date,
  db: Executor = getDb(),
) {
  await db.update(sessions).set({ expiresAt }).where(eq(sessions.id, id));
}

export async function deleteSession(id: string, db: Executor = getDb()) {
  await db.delete(sessions).where(eq(sessions.id, id));
}
