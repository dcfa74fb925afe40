import { renderMessage } from "./layout";

export function signInAlertEmail(input: {
  failures: number;
  windowMinutes: number;
  accountUrl: string;
}) {
  return {
    subject: "Failed sign-in attempts on your Isopleth account",
    ...renderMessage(
      [
        `There were ${input.failures} failed attempts to sign in to your Isopleth account in the last ${input.windowMinutes} minutes. None of them got in.`,
        "To protect your account, sign-in from devices that have not signed in to it before is slowed down for a while. Devices you have already signed in from are not affected.",
        "If these attempts were not yours and your password is short or used on another site, change it now.",
      ],
      { label: "Change your password", url: input.accountUrl },
      "We send this message at most once an hour while the attempts go on.",
    ),
  };
}
