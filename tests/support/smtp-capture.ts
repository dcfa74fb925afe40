import type { AddressInfo } from "node:net";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export type CapturedMail = { to: string[]; subject: string; text: string };

/**
 * A real SMTP server on a free loopback port that keeps what it receives, for integration tests of code that
 * sends mail through nodemailer (the same kind of server scripts/fake-smtp.ts runs for the browser tests).
 */
export async function startSmtpCapture(): Promise<{
  port: number;
  messages: CapturedMail[];
  close: () => Promise<void>;
}> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.push({
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const port = (server.server.address() as AddressInfo).port;
  return {
    port,
    messages,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
