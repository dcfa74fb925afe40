import { and, count, eq, gt, lt, max } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { signInAttempts } from "../schema";

/**
 * Writes an attempt as a failure before the password is checked, so that concurrent guesses (in this process
 * or another) count each other; `markSignInAttemptSucceeded` flips it, `deleteSignInAttempt` drops a refused one.
 */
export async function insertSignInAttempt(
  input: { email: string; ipAddress: string; at: Date },
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db
    .insert(signInAttempts)
    .values({
      email: input.email,
      ipAddress: input.ipAddress,
      succeeded: false,
      createdAt: input.at,
    })
    .$returningId();
  if (!row) throw new Error("sign-in attempt insert returned no id");
  return row.id;
}

export async function markSignInAttemptSucceeded(
  id: number,
  db: Executor = getDb(),
) {
  await db
    .update(signInAttempts)
    .set({ succeeded: true })
    .where(eq(signInAttempts.id, id));
}

export async function deleteSignInAttempt(id: number, db: Executor = getDb()) {
  await db.delete(signInAttempts).where(eq(signInAttempts.id, id));
}

type FailureCount = { failures: number; lastFailureAt: Date | null };

/**
 * What the throttle needs about the attempts recorded before attempt `beforeId`:
 * failures of this (account, client address) pair since its last success and `pairSince`; failures of the account
 * from any address, and of the address for any account, since `windowSince`; whether this address has signed in
 * to this account since `knownSince` (a known client).
 */
export async function getSignInHistory(
  input: {
    email: string;
    ipAddress: string;
    beforeId: number;
    pairSince: Date;
    windowSince: Date;
    knownSince: Date;
  },
  db: Executor = getDb(),
): Promise<{
  pair: FailureCount;
  account: FailureCount;
  address: FailureCount;
  knownClient: boolean;
}> {
  const before = lt(signInAttempts.id, input.beforeId);
  const pairMatch = and(
    eq(signInAttempts.email, input.email),
    eq(signInAttempts.ipAddress, input.ipAddress),
    before,
  );
  const [lastPairSuccess] = await db
    .select({ at: max(signInAttempts.createdAt) })
    .from(signInAttempts)
    .where(and(pairMatch, eq(signInAttempts.succeeded, true)));
  const successAt = lastPairSuccess?.at ? new Date(lastPairSuccess.at) : null;
  const pairSince =
    successAt && successAt > input.pairSince ? successAt : input.pairSince;
  const failuresWhere = async (
    where: ReturnType<typeof and>,
    since: Date,
  ): Promise<FailureCount> => {
    const [row] = await db
      .select({ n: count(), last: max(signInAttempts.createdAt) })
      .from(signInAttempts)
      .where(
        and(
          where,
          eq(signInAttempts.succeeded, false),
          gt(signInAttempts.createdAt, since),
        ),
      );
    return {
      failures: row?.n ?? 0,
      lastFailureAt: row?.last ? new Date(row.last) : null,
    };
  };
  return {
    pair: await failuresWhere(pairMatch, pairSince),
    account: await failuresWhere(
      and(eq(signInAttempts.email, input.email), before),
      input.windowSince,
    ),
    address: await failuresWhere(
      and(eq(signInAttempts.ipAddress, input.ipAddress), before),
      input.windowSince,
    ),
    knownClient: !!successAt && successAt > input.knownSince,
  };
}
