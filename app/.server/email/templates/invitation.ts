import { ROLE_LABELS, type Role } from "~/utils/permissions";
import { renderMessage } from "./layout";

export function invitationEmail(input: {
  inviterName: string;
  role: Role;
  url: string;
  expiresInHours: number;
}) {
  return {
    subject: "You are invited to Isopleth",
    ...renderMessage(
      [
        `${input.inviterName} has invited you to Isopleth, where your team keeps its reservoir fluid-property tables.`,
        `Your role will be: ${ROLE_LABELS[input.role]}. Open the link below to choose your name and password. The link works once and expires in ${input.expiresInHours} hours.`,
      ],
      { label: "Accept the invitation", url: input.url },
      "If you did not expect this invitation, ignore this message.",
    ),
  };
}
