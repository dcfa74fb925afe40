import { recordAudit } from "~/.server/db/queries/audit";
import { consumeLinkToken, createLinkToken, getUsableLinkToken } from "~/.server/db/queries/link-tokens";
import { recentFailures, recordSignInAttempt } from "~/.server/db/queries/sign-in-attempts";
import {
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
import { getEnv } from "~/.server/env";
import type { Role } from "~/utils/permissions";
import { hashPassword, verifyPassword } from "./password";
import { createSession } from "./session";
import { generateToken, hashToken } from "./tokens";

export const LOCKOUT_MAX_FAILURES = 5;
export const LOCKOUT_WINDOW_MS = 15 * 60 * 1000;
export const INVITATION_TTL_MS = 72 * 60 * 60 * 1000;
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/** The one message for an unknown address and a wrong password, so neither gives the other away. */
export const SIGN_IN_FAILED_MESSAGE = "The e-mail address or the password is not right.";

type RequestMeta = { ipAddress: string; userAgent: string | null };

export type SignInResult =
  | { ok: true; userId: number; setCookie: string }
  | { ok: false; reason: "invalid"; message: string }
  | { ok: false; reason: "locked"; message: string; retryAfterSeconds: number };

// A real argon2id hash of a random string, so an unknown address costs as much time as a wrong password.
let dummyHash: Promise<string> | undefined;

export async function signIn(input: { email: string; password: string } & RequestMeta): Promise<SignInResult> {
  const email = normaliseEmail(input.email);
  const now = Date.now();
  const failures = await recentFailures(email, input.ipAddress, new Date(now - LOCKOUT_WINDOW_MS));
  const lockedUntil = Math.max(
    failures.byEmail >= LOCKOUT_MAX_FAILURES && failures.oldestByEmail ? failures.oldestByEmail.getTime() + LOCKOUT_WINDOW_MS : 0,
    failures.byAddress >= LOCKOUT_MAX_FAILURES && failures.oldestByAddress ? failures.oldestByAddress.getTime() + LOCKOUT_WINDOW_MS : 0,
  );
  if (lockedUntil > now) {
    const retryAfterSeconds = Math.ceil((lockedUntil - now) / 1000);
    await recordAudit({ action: "sign_in_refused", details: { email, reason: "too many failed attempts" }, ipAddress: input.ipAddress });
    return {
      ok: false,
      reason: "locked",
      retryAfterSeconds,
      message: `Too many failed sign-in attempts. For your security, signing in is paused; try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s), or reset your password.`,
    };
  }

  const user = await getUserCredentialsByEmail(email);
  dummyHash ??= hashPassword(generateToken());
  const valid = await verifyPassword(user?.passwordHash ?? (await dummyHash), input.password);
  if (!user || !user.passwordHash || !valid || user.disabledAt) {
    await recordSignInAttempt({ email, ipAddress: input.ipAddress, succeeded: false });
    await recordAudit({ action: "sign_in_failed", userId: user?.id ?? null, details: { email }, ipAddress: input.ipAddress });
    return { ok: false, reason: "invalid", message: SIGN_IN_FAILED_MESSAGE };
  }
  await recordSignInAttempt({ email, ipAddress: input.ipAddress, succeeded: true });
  const { setCookie } = await createSession(user.id, input);
  await recordAudit({ action: "sign_in", userId: user.id, ipAddress: input.ipAddress });
  return { ok: true, userId: user.id, setCookie };
}

export async function inviteUser(input: { inviterId: number; inviterName: string; email: string; role: Role; ipAddress: string }) {
  const token = generateToken();
  const email = normaliseEmail(input.email);
  await createLinkToken({
    kind: "invitation",
    tokenHash: hashToken(token),
    email,
    role: input.role,
    createdBy: input.inviterId,
    expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
  });
  const url = `${getEnv().APP_BASE_URL}/invitation/${token}`;
  await sendEmail({ to: email, ...invitationEmail({ inviterName: input.inviterName, role: input.role, url, expiresInHours: 72 }) });
  await recordAudit({ action: "invitation_sent", userId: input.inviterId, entityType: "invitation", details: { email, role: input.role }, ipAddress: input.ipAddress });
}

export async function getInvitation(token: string) {
  return getUsableLinkToken("invitation", hashToken(token));
}

export type AcceptResult = { ok: true; setCookie: string } | { ok: false; message: string };

export async function acceptInvitation(input: { token: string; name: string; password: string } & RequestMeta): Promise<AcceptResult> {
  const invitation = await getInvitation(input.token);
  if (!invitation || !invitation.role) return { ok: false, message: "This invitation link has expired or has already been used. Ask an administrator for a new one." };
  if (await getUserCredentialsByEmail(invitation.email)) {
    return { ok: false, message: "An account with this e-mail address already exists. Sign in, or reset your password." };
  }
  const passwordHash = await hashPassword(input.password);
  if (!(await consumeLinkToken(invitation.id))) {
    return { ok: false, message: "This invitation link has expired or has already been used. Ask an administrator for a new one." };
  }
  const userId = await createUser({ email: invitation.email, name: input.name, role: invitation.role, passwordHash });
  await recordAudit({ action: "invitation_accepted", userId, entityType: "user", entityId: userId, details: { invitedBy: invitation.createdBy, role: invitation.role }, ipAddress: input.ipAddress });
  const { setCookie } = await createSession(userId, input);
  await recordAudit({ action: "sign_in", userId, ipAddress: input.ipAddress });
  return { ok: true, setCookie };
}

/** Always behaves the same for known and unknown addresses; only a known, enabled account gets a message. */
export async function requestPasswordReset(input: { email: string; ipAddress: string }): Promise<void> {
  const email = normaliseEmail(input.email);
  const user = await getUserCredentialsByEmail(email);
  await recordAudit({ action: "password_reset_requested", userId: user?.id ?? null, details: { email }, ipAddress: input.ipAddress });
  if (!user || user.disabledAt) return;
  const token = generateToken();
  await createLinkToken({
    kind: "password_reset",
    tokenHash: hashToken(token),
    email,
    userId: user.id,
    expiresAt: new Date(Date.now() + PASSWORD_RESET_TTL_MS),
  });
  const url = `${getEnv().APP_BASE_URL}/reset-password/${token}`;
  await sendEmail({ to: email, ...passwordResetEmail({ url, expiresInMinutes: 60 }) });
}

export async function getPasswordReset(token: string) {
  return getUsableLinkToken("password_reset", hashToken(token));
}

export async function resetPassword(input: { token: string; password: string } & RequestMeta): Promise<AcceptResult> {
  const reset = await getPasswordReset(input.token);
  const expired = "This reset link has expired or has already been used. Ask for a new one.";
  if (!reset || !reset.userId) return { ok: false, message: expired };
  const user = await getUserById(reset.userId);
  if (!user || user.disabledAt) return { ok: false, message: expired };
  const passwordHash = await hashPassword(input.password);
  if (!(await consumeLinkToken(reset.id))) return { ok: false, message: expired };
  await updateUserPassword(user.id, passwordHash, null);
  await recordAudit({ action: "password_reset", userId: user.id, ipAddress: input.ipAddress });
  const { setCookie } = await createSession(user.id, input);
  await recordAudit({ action: "sign_in", userId: user.id, ipAddress: input.ipAddress });
  return { ok: true, setCookie };
}

export async function changePassword(input: {
  userId: number;
  sessionId: string;
  currentPassword: string;
  newPassword: string;
  ipAddress: string;
}): Promise<{ ok: true } | { ok: false; field: "currentPassword"; message: string }> {
  const hash = await getUserPasswordHash(input.userId);
  if (!hash || !(await verifyPassword(hash, input.currentPassword))) {
    return { ok: false, field: "currentPassword", message: "The current password is not right." };
  }
  await updateUserPassword(input.userId, await hashPassword(input.newPassword), input.sessionId);
  await recordAudit({ action: "password_changed", userId: input.userId, ipAddress: input.ipAddress });
  return { ok: true };
}
