import { getDb, type Executor } from "~/.server/db/client";
import { recordAudit } from "~/.server/db/queries/audit";
import {
  getUserById,
  setUserDisabled,
  updateUserRole,
} from "~/.server/db/queries/users";
import { ROLE_LABELS, type Role } from "~/utils/permissions";

/*
 * Administering people: changing a role, disabling and enabling an account. The rules live here, not in the
 * page: the person must still exist, and an administrator can neither demote nor disable themself (another
 * administrator must), so an installation is never left without one by accident. Each change and its audit row
 * are one transaction.
 */

export type PeopleOutcome =
  { ok: true; done: string } | { ok: false; formError: string };

type Change = { actorId: number; userId: number; ipAddress: string };

const GONE = "That person no longer exists.";

export async function changeRole(
  input: Change & { role: Role },
  db: Executor = getDb(),
): Promise<PeopleOutcome> {
  return db.transaction(async (tx): Promise<PeopleOutcome> => {
    const person = await getUserById(input.userId, tx);
    if (!person) return { ok: false, formError: GONE };
    if (person.id === input.actorId && input.role !== "admin")
      return {
        ok: false,
        formError:
          "You cannot remove your own administrator role; ask another administrator.",
      };
    await updateUserRole(person.id, input.role, tx);
    await recordAudit(
      {
        action: "role_changed",
        userId: input.actorId,
        entityType: "user",
        entityId: person.id,
        details: { from: person.role, to: input.role },
        ipAddress: input.ipAddress,
      },
      tx,
    );
    return {
      ok: true,
      done: `${person.name} is now ${ROLE_LABELS[input.role]}.`,
    };
  });
}

/** Disabling also ends every session of the account (setUserDisabled). */
export async function setAccountDisabled(
  input: Change & { disabled: boolean },
  db: Executor = getDb(),
): Promise<PeopleOutcome> {
  return db.transaction(async (tx): Promise<PeopleOutcome> => {
    const person = await getUserById(input.userId, tx);
    if (!person) return { ok: false, formError: GONE };
    if (person.id === input.actorId)
      return { ok: false, formError: "You cannot disable your own account." };
    await setUserDisabled(person.id, input.disabled, tx);
    await recordAudit(
      {
        action: input.disabled ? "account_disabled" : "account_enabled",
        userId: input.actorId,
        entityType: "user",
        entityId: person.id,
        ipAddress: input.ipAddress,
      },
      tx,
    );
    return {
      ok: true,
      done: `${person.name} is ${input.disabled ? "disabled and signed out everywhere" : "enabled again"}.`,
    };
  });
}
