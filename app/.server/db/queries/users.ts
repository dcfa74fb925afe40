import { and, asc, eq, isNull, lt, ne, or, sql } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import type { OutputSystem } from "~/core/units";
import { sessions, users, type Role } from "../schema";
import { voidPasswordResetLinks } from "./link-tokens";

const PUBLIC_COLUMNS = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  unitSystem: users.unitSystem,
  disabledAt: users.disabledAt,
  createdAt: users.createdAt,
};

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function getUserById(id: number, db: Executor = getDb()) {
  const [row] = await db
    .select(PUBLIC_COLUMNS)
    .from(users)
    .where(eq(users.id, id));
  return row ?? null;
}

/** For sign-in only: includes the password hash. */
export async function getUserCredentialsByEmail(
  email: string,
  db: Executor = getDb(),
) {
  const [row] = await db
    .select({ ...PUBLIC_COLUMNS, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, normaliseEmail(email)));
  return row ?? null;
}

export async function getUserPasswordHash(id: number, db: Executor = getDb()) {
  const [row] = await db
    .select({ passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.id, id));
  return row?.passwordHash ?? null;
}

export async function listUsers(db: Executor = getDb()) {
  return db.select(PUBLIC_COLUMNS).from(users).orderBy(asc(users.name));
}

export async function createUser(
  input: { email: string; name: string; role: Role; passwordHash: string },
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db
    .insert(users)
    .values({ ...input, email: normaliseEmail(input.email) })
    .$returningId();
  if (!row) throw new Error("user insert returned no id");
  return row.id;
}

export async function updateUserProfile(
  id: number,
  patch: { name?: string; unitSystem?: OutputSystem },
  db: Executor = getDb(),
) {
  await db.update(users).set(patch).where(eq(users.id, id));
}

export async function updateUserRole(
  id: number,
  role: Role,
  db: Executor = getDb(),
) {
  await db.update(users).set({ role }).where(eq(users.id, id));
}

/** Disabling ends every session of the account at once. */
export async function setUserDisabled(
  id: number,
  disabled: boolean,
  db: Executor = getDb(),
) {
  await db.transaction(async (tx) => {
    await tx
      .update(users)
      .set({ disabledAt: disabled ? new Date() : null })
      .where(eq(users.id, id));
    if (disabled) await tx.delete(sessions).where(eq(sessions.userId, id));
  });
}

/**
 * Sets a new password hash, ends every other session of the user (all of them when keepSessionId is null) and
 * kills any live reset link, in one transaction.
 */
export async function updateUserPassword(
  id: number,
  passwordHash: string,
  keepSessionId: string | null,
  db: Executor = getDb(),
) {
  await db.transaction(async (tx) => {
    await tx.update(users).set({ passwordHash }).where(eq(users.id, id));
    await tx
      .delete(sessions)
      .where(
        keepSessionId
          ? and(eq(sessions.userId, id), ne(sessions.id, keepSessionId))
          : eq(sessions.userId, id),
      );
    await voidPasswordResetLinks(id, new Date(), tx);
  });
}

/**
 * Claims the right to warn the owner that their account is under attack: true for the one caller (in any
 * process) that finds no warning sent within the last `windowMs`, false for everyone else.
 */
export async function claimSignInAlert(
  id: number,
  now: Date,
  windowMs: number,
  db: Executor = getDb(),
): Promise<boolean> {
  const [result] = await db
    .update(users)
    .set({ signInAlertAt: now, updatedAt: sql`${users.updatedAt}` })
    .where(
      and(
        eq(users.id, id),
        or(
          isNull(users.signInAlertAt),
          lt(users.signInAlertAt, new Date(now.getTime() - windowMs)),
        ),
      ),
    );
  return result.affectedRows === 1;
}
