import { and, asc, eq, sql } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { sampleFollows, users } from "../schema";

/* Who follows a sample (and is told by e-mail when a revision of it is approved). */

export async function isFollowing(
  sampleId: number,
  userId: number,
  db: Executor = getDb(),
): Promise<boolean> {
  const [row] = await db
    .select({ id: sampleFollows.id })
    .from(sampleFollows)
    .where(
      and(
        eq(sampleFollows.sampleId, sampleId),
        eq(sampleFollows.userId, userId),
      ),
    );
  return !!row;
}

/** Follow (idempotent). */
export async function followSample(
  sampleId: number,
  userId: number,
  db: Executor = getDb(),
): Promise<void> {
  await db
    .insert(sampleFollows)
    .values({ sampleId, userId })
    .onDuplicateKeyUpdate({ set: { sampleId } });
}

export async function unfollowSample(
  sampleId: number,
  userId: number,
  db: Executor = getDb(),
): Promise<void> {
  await db
    .delete(sampleFollows)
    .where(
      and(
        eq(sampleFollows.sampleId, sampleId),
        eq(sampleFollows.userId, userId),
      ),
    );
}

export async function countFollowers(
  sampleId: number,
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)` })
    .from(sampleFollows)
    .where(eq(sampleFollows.sampleId, sampleId));
  return Number(row?.n ?? 0);
}

/** People following the sample whose accounts are active (for the approval e-mail). */
export async function listActiveFollowers(
  sampleId: number,
  db: Executor = getDb(),
) {
  return db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(sampleFollows)
    .innerJoin(users, eq(users.id, sampleFollows.userId))
    .where(
      and(
        eq(sampleFollows.sampleId, sampleId),
        sql`${users.disabledAt} is null`,
      ),
    )
    .orderBy(asc(users.email));
}
