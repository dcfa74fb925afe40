import nodemailer, { type Transporter } from "nodemailer";
import { getEnv } from "~/.server/env";

let transporter: Transporter | undefined;

/** SMTP through nodemailer, from the environment (a local fake SMTP server in development and tests). */
export function getTransport(): Transporter {
  if (!transporter) {
    const env = getEnv();
    const local =
      env.SMTP_HOST === "127.0.0.1" || env.SMTP_HOST === "localhost";
    transporter = nodemailer.createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      ignoreTLS: local && !env.SMTP_SECURE,
      auth: env.SMTP_USER
        ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" }
        : undefined,
      connectionTimeout: 10_000,
    });
  }
  return transporter;
}
