import { renderMessage } from "./layout";

export function passwordResetEmail(input: {
  url: string;
  expiresInMinutes: number;
}) {
  return {
    subject: "Reset your Isopleth password",
    ...renderMessage(
      [
        "Someone (hopefully you) asked to reset the password of your Isopleth account.",
        `Open the link below to choose a new password. The link works once and expires in ${input.expiresInMinutes} minutes. Signing in with a new password ends your other sessions.`,
      ],
      { label: "Choose a new password", url: input.url },
      "If you did not ask for this, ignore this message: your password stays as it is.",
    ),
  };
}
