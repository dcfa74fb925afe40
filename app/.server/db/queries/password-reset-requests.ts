import { and, count, eq, gt } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { passwordResetRequests } from "../schema";

export async function recordPasswordResetRequest(
  input: { email: string; ipAddress: string; sent: boolean; at: Date },
  db: Executor = getDb(),
) {
  await db.insert(passwordResetRequests).values({
    email: input.email,
    ipAddress: input.ipAddress,
    sent: input.sent,
    createdAt: input.at,
  });
}

/** Reset messages sent since `since`: to this address, and on requests from this client address. */
export async function countSentPasswordResets(
  input: { email: string; ipAddress: string; since: Date },
  db: Executor = getDb(),
): Promise<{ toEmail: number; fromAddress: number }> {
  const sentSince = and(
    eq(passwordResetRequests.sent, true),
    gt(passwordResetRequests.createdAt, input.since),
  );
  const [toEmail] = await db
    .select({ n: count() })
    .from(passwordResetRequests)
    .where(and(sentSince, eq(passwordResetRequests.email, input.email)));
  const [fromAddress] = await db
    .select({ n: count() })
    .from(passwordResetRequests)
    .where(
      and(sentSince, eq(passwordResetRequests.ipAddress, input.ipAddress)),
    );
  return { toEmail: toEmail?.n ?? 0, fromAddress: fromAddress?.n ?? 0 };
}
