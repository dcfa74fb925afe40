/*
 * Four-eyes approval: "a revision must be approved by someone other than its uploader". Client-safe, so the
 * admin page and the review panel explain the rule the server enforces (app/.server/samples/review.ts).
 *
 * The administrator chooses one of three modes. "auto", the default (no row in lab_settings), turns the rule on
 * exactly when the installation has two or more ACTIVE lab leads: accounts whose role is lab_lead and that are
 * not disabled, counted at the moment of each approval. Administrators are not counted (they may approve, but a
 * lab with one lab lead and an administrator still has one person whose job is to review results).
 */
export const FOUR_EYES_MODES = ["auto", "on", "off"] as const;
export type FourEyesMode = (typeof FOUR_EYES_MODES)[number];

/** Two or more active lab leads turn "auto" on. */
export const FOUR_EYES_AUTO_MIN_LAB_LEADS = 2;

export const FOUR_EYES_MODE_LABELS: Record<FourEyesMode, string> = {
  auto: "Automatic: on when there are two or more active lab leads",
  on: "Always on",
  off: "Off: an uploader may approve their own revision (the history shows it)",
};

export type FourEyesPolicy = {
  mode: FourEyesMode;
  activeLabLeads: number;
  required: boolean;
};

export function fourEyesRequired(
  mode: FourEyesMode,
  activeLabLeads: number,
): boolean {
  return (
    mode === "on" ||
    (mode === "auto" && activeLabLeads >= FOUR_EYES_AUTO_MIN_LAB_LEADS)
  );
}

/** "On (automatic: 2 active lab leads)". */
export function describeFourEyes(policy: FourEyesPolicy): string {
  const state = policy.required ? "On" : "Off";
  if (policy.mode !== "auto") return `${state} (set by an administrator)`;
  const leads = `${policy.activeLabLeads} active lab ${policy.activeLabLeads === 1 ? "lead" : "leads"}`;
  return `${state} (automatic: ${leads})`;
}
