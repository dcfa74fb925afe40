import { z } from "zod";
import { multilineTextSchema } from "~/utils/labels";

/** The review form of a draft revision, checked in the browser and again by the server. */
export const ReviewSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({
      intent: z.literal("approve"),
      comment: multilineTextSchema("review comment")
        .trim()
        .max(2000, "Use at most 2000 characters.")
        .optional()
        .default(""),
      acknowledge: z.literal("yes").optional(),
    }),
    z.object({
      intent: z.literal("reject"),
      comment: multilineTextSchema("review comment")
        .trim()
        .min(1, "Say why the revision is rejected; the uploader will read it.")
        .max(2000, "Use at most 2000 characters."),
      acknowledge: z.string().optional(),
    }),
  ],
  { error: "Choose approve or reject." },
);

export type ReviewForm = z.output<typeof ReviewSchema>;
