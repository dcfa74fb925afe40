// Local stand-in for a mail server, for `npm start`, `npm run dev` and `npm test` only.
// Accepts SMTP on 127.0.0.1:SMTP_PORT and keeps every message in memory; GET /messages on
// 127.0.0.1:SMTP_HTTP_PORT lists them as JSON, DELETE /messages clears them.
import { createServer } from "node:http";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

type Captured = {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
};

const smtpPort = Number(process.argv[2] ?? 2525);
const httpPort = Number(process.argv[3] ?? 2580);
const messages: Captured[] = [];
let nextId = 1;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", () => {
      simpleParser(Buffer.concat(chunks))
        .then((parsed) => {
          messages.push({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom
              ? session.envelope.mailFrom.address
              : "",
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : "",
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    });
  },
});

const http = createServer((req, res) => {
  if (req.url?.startsWith("/messages")) {
    if (req.method === "DELETE") {
      messages.length = 0;
      res.writeHead(204).end();
      return;
    }
    res
      .writeHead(200, { "Content-Type": "application/json" })
      .end(JSON.stringify(messages));
    return;
  }
  res.writeHead(404).end();
});

// A port that is taken is named, with the variable that sets it, and the process ends (start.sh reports it).
function failOn(
  server: {
    on(
      event: "error",
      listener: (error: NodeJS.ErrnoException) => void,
    ): unknown;
  },
  port: number,
  variable: string,
) {
  server.on("error", (error) => {
    const reason =
      error.code === "EADDRINUSE"
        ? "is already in use"
        : `cannot be listened on (${error.code ?? error.message})`;
    process.stderr.write(
      `fake SMTP: port ${port} (${variable}) on 127.0.0.1 ${reason}\n`,
    );
    process.exit(1);
  });
}
failOn(smtp, smtpPort, "SMTP_PORT");
failOn(http, httpPort, "SMTP_HTTP_PORT");

smtp.listen(smtpPort, "127.0.0.1", () => {
  http.listen(httpPort, "127.0.0.1", () => {
    console.log(
      `fake SMTP on 127.0.0.1:${smtpPort}, messages at http://127.0.0.1:${httpPort}/messages`,
    );
  });
});

for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.on(signal, () => {
    http.close();
    smtp.close(() => process.exit(0));
  });
}
