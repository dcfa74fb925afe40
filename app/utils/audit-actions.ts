/** Actions recorded in the audit log (client-safe, for filters). */
export const AUDIT_ACTIONS = [
  "sign_in",
  "sign_in_failed",
  "sign_in_refused",
  "sign_out",
  "invitation_sent",
  "invitation_accepted",
  "role_changed",
  "account_disabled",
  "account_enabled",
  "password_changed",
  "password_reset_requested",
  "password_reset",
  "sample_created",
  "sample_updated",
  "revision_uploaded",
  "revision_approved",
  "revision_rejected",
  "api_token_created",
  "api_token_revoked",
  "api_token_used",
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];
