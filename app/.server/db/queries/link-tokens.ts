import { and, eq, gt, isNull } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { linkTokens, type LinkTokenKind, type Role } from "../schema";

export async function createLinkToken(
  input: {
    kind: LinkTokenKind;
    tokenHash: string;
    email: string;
    role?: Role | null;
    userId?: number | null;
    createdBy?: number | null;
    expiresAt: Date;
  },
  db: Executor = getDb(),
) {
  await db.insert(linkTokens).values({
    ...input,
    role: input.role ?? null,
    userId: input.userId ?? null,
  });
}

/** Kills every live reset link of the user (marks it used), so that at most one link works at a time. */
export async function voidPasswordResetLinks(
  userId: number,
  now = new Date(),
  db: Executor = getDb(),
) {
  await db
    .update(linkTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(linkTokens.kind, "password_reset"),
        eq(linkTokens.userId, userId),
        isNull(linkTokens.usedAt),
      ),
    );
}

/** A new reset link for the user; any older one stops working in the same transaction. */
export async function createPasswordResetLink(
  input: {
    userId: number;
    email: string;
    tokenHash: string;
    expiresAt: Date;
    now?: Date;
  },
  db: Executor = getDb(),
) {
  await db.transaction(async (tx) => {
    await voidPasswordResetLinks(input.userId, input.now, tx);
    await createLinkToken(
      {
        kind: "password_reset",
        tokenHash: input.tokenHash,
        email: input.email,
        userId: input.userId,
        expiresAt: input.expiresAt,
      },
      tx,
    );
  });
}

/** A link that is neither used nor expired, or null. */
export async function getUsableLinkToken(
  kind: LinkTokenKind,
  tokenHash: string,
  db: Executor = getDb(),
) {
  const [row] = await db
    .select({
      id: linkTokens.id,
      email: linkTokens.email,
      role: linkTokens.role,
      userId: linkTokens.userId,
      createdBy: linkTokens.createdBy,
      expiresAt: linkTokens.expiresAt,
    })
    .from(linkTokens)
    .where(
      and(
        eq(linkTokens.kind, kind),
        eq(linkTokens.tokenHash, tokenHash),
        isNull(linkTokens.usedAt),
        gt(linkTokens.expiresAt, new Date()),
      ),
    );
  return row ?? null;
}

/** Marks a link used; true only for the one caller that used it first (single use under concurrency). */
export async function consumeLinkToken(
  id: number,
  db: Executor = getDb(),
): Promise<boolean> {
  const [result] = await db
    .update(linkTokens)
    .set({ usedAt: new Date() })
    .where(
      and(
        eq(linkTokens.id, id),
        isNull(linkTokens.usedAt),
        gt(linkTokens.expiresAt, new Date()),
      ),
    );
  return result.affectedRows === 1;
}
