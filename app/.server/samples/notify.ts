import { listActiveFollowers } from "~/.server/db/queries/follows";
import { revisionApprovedEmail } from "~/.server/email/templates/revision-approved";
import { sendEmail } from "~/.server/email/send";
import { getEnv } from "~/.server/env";

/**
 * Tells the sample's followers that a revision was approved, with a link to the diff against the revision it
 * replaced (or to the revision itself when it is the first approved one). Runs after the approval is committed;
 * a failed message is logged and does not undo the approval. Returns how many messages went out.
 */
export async function notifyFollowersOfApproval(input: {
  sample: { id: number; label: string; wellName: string; fieldName: string };
  number: number;
  previousNumber: number | null;
  approverName: string;
}): Promise<number> {
  const followers = await listActiveFollowers(input.sample.id);
  if (followers.length === 0) return 0;
  const base = getEnv().APP_BASE_URL.replace(/\/$/, "");
  const url =
    input.previousNumber === null
      ? `${base}/samples/${input.sample.id}/revisions/${input.number}`
      : `${base}/samples/${input.sample.id}/diff?from=${input.previousNumber}&to=${input.number}`;
  const message = revisionApprovedEmail({
    sampleLabel: input.sample.label,
    wellName: input.sample.wellName,
    fieldName: input.sample.fieldName,
    number: input.number,
    previousNumber: input.previousNumber,
    approverName: input.approverName,
    url,
  });
  const results = await Promise.allSettled(
    followers.map((f) => sendEmail({ to: f.email, ...message })),
  );
  const failed = results.filter((r) => r.status === "rejected");
  if (failed.length > 0)
    console.warn(
      `revision-approved e-mail: ${failed.length} of ${results.length} messages failed`,
      failed.map((f) => String((f as PromiseRejectedResult).reason)),
    );
  return results.length - failed.length;
}
