import { and, desc, eq, isNull } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { apiTokens, users, type ApiScope } from "../schema";

export type TokenRestriction = {
  fieldIds?: number[];
  sampleIds?: number[];
} | null;

export async function insertApiToken(
  row: {
    id: string;
    userId: number;
    name: string;
    scopes: ApiScope[];
    restriction: TokenRestriction;
    expiresAt: Date;
  },
  db: Executor = getDb(),
) {
  await db.insert(apiTokens).values(row);
}

/** The token record with its owner, for checking a presented JWT on every request. */
export async function getApiTokenForUse(id: string, db: Executor = getDb()) {
  const [row] = await db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      scopes: apiTokens.scopes,
      restriction: apiTokens.restriction,
      expiresAt: apiTokens.expiresAt,
      revokedAt: apiTokens.revokedAt,
      user: {
        id: users.id,
        email: users.email,
        name: users.name,
        role: users.role,
        unitSystem: users.unitSystem,
        disabledAt: users.disabledAt,
      },
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.id, id));
  return row ?? null;
}

export async function touchApiToken(
  id: string,
  at = new Date(),
  db: Executor = getDb(),
) {
  await db
    .update(apiTokens)
    .set({ lastUsedAt: at })
    .where(eq(apiTokens.id, id));
}

export async function listApiTokens(
  filter: { userId?: number },
  db: Executor = getDb(),
) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      scopes: apiTokens.scopes,
      restriction: apiTokens.restriction,
      expiresAt: apiTokens.expiresAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
      createdAt: apiTokens.createdAt,
      userId: apiTokens.userId,
      ownerName: users.name,
      ownerEmail: users.email,
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(
      filter.userId === undefined
        ? undefined
        : eq(apiTokens.userId, filter.userId),
    )
    .orderBy(desc(apiTokens.createdAt));
}

export async function getApiTokenOwner(id: string, db: Executor = getDb()) {
  const [row] = await db
    .select({
      userId: apiTokens.userId,
      revokedAt: apiTokens.revokedAt,
      name: apiTokens.name,
    })
    .from(apiTokens)
    .where(eq(apiTokens.id, id));
  return row ?? null;
}

export async function revokeApiToken(
  id: string,
  revokedBy: number,
  db: Executor = getDb(),
): Promise<boolean> {
  const [result] = await db
    .update(apiTokens)
    .set({ revokedAt: new Date(), revokedBy })
    .where(and(eq(apiTokens.id, id), isNull(apiTokens.revokedAt)));
  return result.affectedRows === 1;
}
