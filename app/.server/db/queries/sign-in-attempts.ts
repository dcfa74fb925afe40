import { and, asc, count, desc, eq, gt, min } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { signInAttempts } from "../schema";

export async function recordSignInAttempt(
  input: { email: string; ipAddress: string; succeeded: boolean },
  db: Executor = getDb(),
) {
  await db.insert(signInAttempts).values(input);
}

/**
 * Failed attempts within the window: for the account (only those after its last successful sign-in)
 * and for the client address. Returns the counts and when the oldest counted failure leaves the window.
 */
export async function recentFailures(email: string, ipAddress: string, since: Date, db: Executor = getDb()) {
  const [lastSuccess] = await db
    .select({ at: signInAttempts.createdAt })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, true), gt(signInAttempts.createdAt, since)))
    .orderBy(desc(signInAttempts.createdAt))
    .limit(1);
  const accountSince = lastSuccess ? lastSuccess.at : since;
  const [byEmail] = await db
    .select({ n: count(), oldest: min(signInAttempts.createdAt) })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), eq(signInAttempts.succeeded, false), gt(signInAttempts.createdAt, accountSince)));
  const byAddress = await db
    .select({ at: signInAttempts.createdAt })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.ipAddress, ipAddress), eq(signInAttempts.succeeded, false), gt(signInAttempts.createdAt, since)))
    .orderBy(asc(signInAttempts.createdAt));
  return {
    byEmail: byEmail?.n ?? 0,
    oldestByEmail: byEmail?.oldest ? new Date(byEmail.oldest) : null,
    byAddress: byAddress.length,
    oldestByAddress: byAddress[0]?.at ?? null,
  };
}
