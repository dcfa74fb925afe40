import { and, count, eq, isNull } from "drizzle-orm";
import {
  fourEyesRequired,
  FOUR_EYES_MODES,
  type FourEyesMode,
  type FourEyesPolicy,
} from "~/utils/four-eyes";
import { getDb, type Executor } from "../client";
import { labSettings, users } from "../schema";
import { recordAudit } from "./audit";

/* Lab policies chosen by an administrator (lab_settings). A key without a row has its default. */

const FOUR_EYES_KEY = "four_eyes_approval";

function asMode(value: string | undefined): FourEyesMode {
  return FOUR_EYES_MODES.find((m) => m === value) ?? "auto";
}

async function countActiveLabLeads(db: Executor = getDb()): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(users)
    .where(and(eq(users.role, "lab_lead"), isNull(users.disabledAt)));
  return Number(row?.n ?? 0);
}

/** The mode chosen, the number of active lab leads now, and whether approval needs a second person. */
export async function getFourEyesPolicy(
  db: Executor = getDb(),
): Promise<FourEyesPolicy> {
  const [row] = await db
    .select({ value: labSettings.value })
    .from(labSettings)
    .where(eq(labSettings.key, FOUR_EYES_KEY));
  const mode = asMode(row?.value);
  const activeLabLeads = await countActiveLabLeads(db);
  return {
    mode,
    activeLabLeads,
    required: fourEyesRequired(mode, activeLabLeads),
  };
}

/** Sets the four-eyes mode and records the change in the audit log, in one transaction. */
export async function setFourEyesMode(
  input: { mode: FourEyesMode; userId: number; ipAddress?: string | null },
  db: Executor = getDb(),
): Promise<{ changed: boolean; from: FourEyesMode; to: FourEyesMode }> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ value: labSettings.value })
      .from(labSettings)
      .where(eq(labSettings.key, FOUR_EYES_KEY))
      .for("update");
    const from = asMode(row?.value);
    if (from === input.mode) return { changed: false, from, to: input.mode };
    await tx
      .insert(labSettings)
      .values({
        key: FOUR_EYES_KEY,
        value: input.mode,
        updatedBy: input.userId,
      })
      .onDuplicateKeyUpdate({
        set: { value: input.mode, updatedBy: input.userId },
      });
    await recordAudit(
      {
        action: "setting_changed",
        userId: input.userId,
        entityType: "lab_setting",
        entityId: FOUR_EYES_KEY,
        details: { key: FOUR_EYES_KEY, from, to: input.mode },
        ipAddress: input.ipAddress ?? null,
      },
      tx,
    );
    return { changed: true, from, to: input.mode };
  });
}
