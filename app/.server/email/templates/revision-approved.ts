import { renderMessage } from "./layout";

/** To people following a sample: a new revision of its tables was approved. */
export function revisionApprovedEmail(input: {
  sampleLabel: string;
  wellName: string;
  fieldName: string;
  number: number;
  previousNumber: number | null;
  approverName: string;
  url: string;
}) {
  const place = `${input.sampleLabel} (well ${input.wellName}, ${input.fieldName})`;
  const what =
    input.previousNumber === null
      ? `Revision ${input.number} of sample ${place} was approved by ${input.approverName}. It is the sample's first approved set of tables.`
      : `Revision ${input.number} of sample ${place} was approved by ${input.approverName}. It replaces revision ${input.previousNumber} as the sample's current tables.`;
  return {
    subject: `New approved tables for ${input.sampleLabel}: revision ${input.number}`,
    ...renderMessage(
      [
        what,
        input.previousNumber === null
          ? "Open the revision to see its grids and quality checks."
          : "Open the comparison to see which measured values changed, were added or were removed.",
      ],
      {
        label:
          input.previousNumber === null
            ? "See the revision"
            : `Compare revision ${input.previousNumber} with revision ${input.number}`,
        url: input.url,
      },
      "You receive this because you follow this sample in Isopleth. Unfollow it on the sample's page to stop these messages.",
    ),
  };
}
