import { getDb, type Executor } from "~/.server/db/client";
import { recordAudit } from "~/.server/db/queries/audit";
import {
  consumeLinkToken,
  createLinkToken,
  createPasswordResetLink,
  getUsableLinkToken,
} from "~/.server/db/queries/link-tokens";
import {
  countSentPasswordResets,
  recordPasswordResetRequest,
} from "~/.server/db/queries/password-reset-requests";
import {
  deleteSignInAttempt,
  getSignInHistory,
  insertSignInAttempt,
  markSignInAttemptSucceeded,
} from "~/.server/db/queries/sign-in-attempts";
import {
  claimSignInAlert,
  createUser,
  getUserById,
  getUserCredentialsByEmail,
  getUserPasswordHash,
  normaliseEmail,
  updateUserPassword,
} from "~/.server/db/queries/users";
import { sendEmail } from "~/.server/email/send";
import { invitationEmail } from "~/.server/email/templates/invitation";
import { passwordResetEmail } from "~/.server/email/templates/password-reset";
import { signInAlertEmail } from "~/.server/email/templates/sign-in-alert";
import { getEnv } from "~/.server/env";
import type { Role } from "~/utils/permissions";
import { runInBackground } from "./background";
import { hashPassword, verifyPassword } from "./password";
import { createSession } from "./session";
import {
  SIGN_IN_THROTTLE,
  signInWait,
  throttledMessage,
  type ThrottleReason,
} from "./sign-in-throttle";
import { generateToken, hashToken } from "./tokens";

const INVITATION_TTL_MS = 72 * 60 * 60 * 1000;
const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;
/** Quiet limits on reset messages (the answer on the page stays the same): per address and per client, per hour. */
const PASSWORD_RESET_LIMITS = {
  windowMs: 60 * 60 * 1000,
  perEmail: 3,
  perClient: 10,
} as const;

/** The one message for an unknown address and a wrong password, so neither gives the other away. */
export const SIGN_IN_FAILED_MESSAGE =
  "The e-mail address or the password is not right.";

type RequestMeta = { ipAddress: string; userAgent: string | null };

type SignInResult =
  | { ok: true; userId: number; setCookie: string }
  | { ok: false; reason: "invalid"; message: string }
  | {
      ok: false;
      reason: "throttled";
      limit: ThrottleReason;
      message: string;
      retryAfterSeconds: number;
    };

// A real argon2id hash of a random string, so an unknown address costs as much time as a wrong password.
let dummyHash: Promise<string> | undefined;

/**
 * Checks the password unless the throttle (./sign-in-throttle.ts) says this client must wait first.
 * `now` is the clock, injectable for tests; every time the throttle compares comes from it.
 */
export async function signIn(
  input: { email: string; password: string; now?: Date } & RequestMeta,
): Promise<SignInResult> {
  const email = normaliseEmail(input.email);
  const now = input.now ?? new Date();
  const attemptId = await insertSignInAttempt({
    email,
    ipAddress: input.ipAddress,
    at: now,
  });
  const history = await getSignInHistory({
    email,
    ipAddress: input.ipAddress,
    beforeId: attemptId,
    pairSince: new Date(now.getTime() - SIGN_IN_THROTTLE.pair.windowMs),
    windowSince: new Date(now.getTime() - SIGN_IN_THROTTLE.account.windowMs),
    knownSince: new Date(now.getTime() - SIGN_IN_THROTTLE.knownClientMs),
  });
  const wait = signInWait(history, now);
  if (wait.reason && wait.waitMs > 0) {
    // A refused attempt checked no password, so it is not counted as a failure.
    const retryAfterSeconds = Math.ceil(wait.waitMs / 1000);
    const limit = wait.reason;
    await getDb().transaction(async (tx) => {
      await deleteSignInAttempt(attemptId, tx);
      await recordAudit(
        {
          action: "sign_in_refused",
          details: { email, limit, retryAfterSeconds },
          ipAddress: input.ipAddress,
        },
        tx,
      );
    });
    return {
      ok: false,
      reason: "throttled",
      limit: wait.reason,
      retryAfterSeconds,
      message: throttledMessage(wait.reason, retryAfterSeconds),
    };
  }

  const user = await getUserCredentialsByEmail(email);
  dummyHash ??= hashPassword(generateToken());
  const valid = await verifyPassword(
    user?.passwordHash ?? (await dummyHash),
    input.password,
  );
  if (!user || !user.passwordHash || !valid || user.disabledAt) {
    // The failure itself was written before the check (insertSignInAttempt); this row only reports it.
    await recordAudit(
      {
        action: "sign_in_failed",
        userId: user?.id ?? null,
        details: { email },
        ipAddress: input.ipAddress,
      },
      getDb(),
    );
    const accountFailures = history.account.failures + 1;
    if (
      user &&
      !user.disabledAt &&
      accountFailures >= SIGN_IN_THROTTLE.account.freeFailures
    ) {
      await warnOwnerOfAttack(user.id, email, accountFailures, now);
    }
    return { ok: false, reason: "invalid", message: SIGN_IN_FAILED_MESSAGE };
  }
  const userId = user.id;
  const { setCookie } = await getDb().transaction(async (tx) => {
    await markSignInAttemptSucceeded(attemptId, tx);
    const session = await createSession(userId, input, tx);
    await recordAudit(
      { action: "sign_in", userId, ipAddress: input.ipAddress },
      tx,
    );
    return session;
  });
  return { ok: true, userId, setCookie };
}

/** One message per alert window, whichever process gets there first; sent off the request path. */
async function warnOwnerOfAttack(
  userId: number,
  email: string,
  failures: number,
  now: Date,
) {
  if (!(await claimSignInAlert(userId, now, SIGN_IN_THROTTLE.alertWindowMs)))
    return;
  const message = signInAlertEmail({
    failures,
    windowMinutes: SIGN_IN_THROTTLE.account.windowMs / 60_000,
    accountUrl: `${getEnv().APP_BASE_URL}/account`,
  });
  runInBackground("sign-in alert e-mail", () =>
    sendEmail({ to: email, ...message }),
  );
}

type InviteResult =
  { ok: true } | { ok: false; field: "email"; message: string };

/**
 * Invites someone who has no account yet. The link, its message and the audit row go together: the link and the
 * row are committed only once the message is handed to the mail server.
 */
export async function inviteUser(input: {
  inviterId: number;
  inviterName: string;
  email: string;
  role: Role;
  ipAddress: string;
}): Promise<InviteResult> {
  const email = normaliseEmail(input.email);
  if (await getUserCredentialsByEmail(email))
    return {
      ok: false,
      field: "email",
      message: "Someone already has an account with this address.",
    };
  const token = generateToken();
  await getDb().transaction(async (tx) => {
    await createLinkToken(
      {
        kind: "invitation",
        tokenHash: hashToken(token),
        email,
        role: input.role,
        createdBy: input.inviterId,
        expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
      },
      tx,
    );
    await recordAudit(
      {
        action: "invitation_sent",
        userId: input.inviterId,
        entityType: "invitation",
        details: { email, role: input.role },
        ipAddress: input.ipAddress,
      },
      tx,
    );
    const url = `${getEnv().APP_BASE_URL}/invitation/${token}`;
    await sendEmail({
      to: email,
      ...invitationEmail({
        inviterName: input.inviterName,
        role: input.role,
        url,
        expiresInHours: 72,
      }),
    });
  });
  return { ok: true };
}

export async function getInvitation(token: string) {
  return getUsableLinkToken("invitation", hashToken(token));
}

type AcceptResult =
  { ok: true; setCookie: string } | { ok: false; message: string };

export async function acceptInvitation(
  input: { token: string; name: string; password: string } & RequestMeta,
): Promise<AcceptResult> {
  const invitation = await getInvitation(input.token);
  if (!invitation || !invitation.role)
    return {
      ok: false,
      message:
        "This invitation link has expired or has already been used. Ask an administrator for a new one.",
    };
  if (await getUserCredentialsByEmail(invitation.email)) {
    return {
      ok: false,
      message:
        "An account with this e-mail address already exists. Sign in, or reset your password.",
    };
  }
  const passwordHash = await hashPassword(input.password);
  const role = invitation.role;
  // The link is used, the account made, the session opened and both audited in one transaction.
  return getDb().transaction(async (tx): Promise<AcceptResult> => {
    if (!(await consumeLinkToken(invitation.id, tx))) {
      return {
        ok: false,
        message:
          "This invitation link has expired or has already been used. Ask an administrator for a new one.",
      };
    }
    const userId = await createUser(
      { email: invitation.email, name: input.name, role, passwordHash },
      tx,
    );
    await recordAudit(
      {
        action: "invitation_accepted",
        userId,
        entityType: "user",
        entityId: userId,
        details: { invitedBy: invitation.createdBy, role },
        ipAddress: input.ipAddress,
      },
      tx,
    );
    const { setCookie } = await createSession(userId, input, tx);
    await recordAudit(
      { action: "sign_in", userId, ipAddress: input.ipAddress },
      tx,
    );
    return { ok: true, setCookie };
  });
}

/**
 * "Forgot password": returns at once and does the rest in the background, so the answer takes the same time
 * whether or not the address has an account (no account enumeration: OWASP Forgot Password Cheat Sheet).
 */
export function requestPasswordReset(input: {
  email: string;
  ipAddress: string;
}): void {
  runInBackground("password reset request", () =>
    processPasswordResetRequest(input),
  );
}

/**
 * The work behind a reset request. Every request is recorded; a message goes only to a known, enabled account,
 * and only while fewer than PASSWORD_RESET_LIMITS messages went to that address, or on requests from that client,
 * in the window. A new link kills the older ones. Returns whether a message went out.
 */
export async function processPasswordResetRequest(input: {
  email: string;
  ipAddress: string;
  now?: Date;
}): Promise<{ sent: boolean }> {
  const email = normaliseEmail(input.email);
  const now = input.now ?? new Date();
  const user = await getUserCredentialsByEmail(email);
  const recent = await countSentPasswordResets({
    email,
    ipAddress: input.ipAddress,
    since: new Date(now.getTime() - PASSWORD_RESET_LIMITS.windowMs),
  });
  const limited =
    recent.toEmail >= PASSWORD_RESET_LIMITS.perEmail ||
    recent.fromAddress >= PASSWORD_RESET_LIMITS.perClient;
  const send = !!user && !user.disabledAt && !limited;
  await getDb().transaction(async (tx) => {
    await recordPasswordResetRequest(
      { email, ipAddress: input.ipAddress, sent: send, at: now },
      tx,
    );
    await recordAudit(
      {
        action: "password_reset_requested",
        userId: user?.id ?? null,
        details: { email, sent: send, ...(limited ? { limited } : {}) },
        ipAddress: input.ipAddress,
      },
      tx,
    );
  });
  if (!user || !send) return { sent: false };
  const token = generateToken();
  await createPasswordResetLink({
    userId: user.id,
    email,
    tokenHash: hashToken(token),
    expiresAt: new Date(now.getTime() + PASSWORD_RESET_TTL_MS),
    now,
  });
  const url = `${getEnv().APP_BASE_URL}/reset-password/${token}`;
  await sendEmail({
    to: email,
    ...passwordResetEmail({
      url,
      expiresInMinutes: PASSWORD_RESET_TTL_MS / 60_000,
    }),
  });
  return { sent: true };
}

export async function getPasswordReset(token: string) {
  return getUsableLinkToken("password_reset", hashToken(token));
}

export async function resetPassword(
  input: { token: string; password: string } & RequestMeta,
): Promise<AcceptResult> {
  const reset = await getPasswordReset(input.token);
  const expired =
    "This reset link has expired or has already been used. Ask for a new one.";
  if (!reset || !reset.userId) return { ok: false, message: expired };
  const user = await getUserById(reset.userId);
  if (!user || user.disabledAt) return { ok: false, message: expired };
  const passwordHash = await hashPassword(input.password);
  const userId = user.id;
  return getDb().transaction(async (tx): Promise<AcceptResult> => {
    if (!(await consumeLinkToken(reset.id, tx)))
      return { ok: false, message: expired };
    await updateUserPassword(userId, passwordHash, null, tx);
    await recordAudit(
      { action: "password_reset", userId, ipAddress: input.ipAddress },
      tx,
    );
    const { setCookie } = await createSession(userId, input, tx);
    await recordAudit(
      { action: "sign_in", userId, ipAddress: input.ipAddress },
      tx,
    );
    return { ok: true, setCookie };
  });
}

export async function changePassword(
  input: {
    userId: number;
    sessionId: string;
    currentPassword: string;
    newPassword: string;
    ipAddress: string;
  },
  db: Executor = getDb(),
): Promise<
  { ok: true } | { ok: false; field: "currentPassword"; message: string }
> {
  const hash = await getUserPasswordHash(input.userId, db);
  if (!hash || !(await verifyPassword(hash, input.currentPassword))) {
    return {
      ok: false,
      field: "currentPassword",
      message: "The current password is not right.",
    };
  }
  const passwordHash = await hashPassword(input.newPassword);
  await db.transaction(async (tx) => {
    await updateUserPassword(input.userId, passwordHash, input.sessionId, tx);
    await recordAudit(
      {
        action: "password_changed",
        userId: input.userId,
        ipAddress: input.ipAddress,
      },
      tx,
    );
  });
  return { ok: true };
}
