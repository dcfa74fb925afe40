import { getEnv } from "~/.server/env";
import { getTransport } from "./transport";

type EmailMessage = {
  to: string;
  subject: string;
  text: string;
  html: string;
};

/** The one way out for e-mail. */
export async function sendEmail(message: EmailMessage): Promise<void> {
  await getTransport().sendMail({ from: getEnv().MAIL_FROM, ...message });
}
