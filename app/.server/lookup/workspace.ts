import { listSamplesForCaller } from "~/.server/api/samples";
import type { SessionUser } from "~/.server/auth/session";
import type { OutputSystem } from "~/core/units";
import { listLookupSets } from "~/.server/db/queries/lookup-sets";
import { can } from "~/utils/permissions";

/**
 * The lookup page: the samples the person may read, in the page's unit system (as the samples API lists them),
 * and their saved lookup sets when their role may save sets (none otherwise).
 */
export async function getLookupWorkspace(
  user: SessionUser,
  units: OutputSystem,
) {
  const canSave = can(user, "save:lookup-sets");
  const [samples, sets] = await Promise.all([
    listSamplesForCaller({ user, token: null }, units),
    canSave ? listLookupSets(user.id) : [],
  ]);
  return { user, canSave, samples, sets };
}
