import { requirePermission } from "~/.server/auth/guards";
import { getEnv } from "~/.server/env";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "Captured e-mail · Isopleth" },
];

type Captured = {
  id: number;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
};

/** Development only: the messages the local fake SMTP server has received, so links can be clicked. */
export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:captured-mail");
  const url = getEnv().MAIL_CAPTURE_URL;
  if (!url)
    throw new Response("There is no local mail capture on this installation.", {
      status: 404,
    });
  try {
    const response = await fetch(url, { signal: AbortSignal.timeout(2_000) });
    const messages = (await response.json()) as Captured[];
    return {
      messages: messages
        .slice()
        .reverse()
        .map(({ id, receivedAt, to, subject, text }) => ({
          id,
          receivedAt,
          to,
          subject,
          text,
        })),
      error: null,
    };
  } catch {
    return {
      messages: [] as Captured[],
      error: "The local mail server did not answer.",
    };
  }
}

export default function CapturedMail({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader title="Captured e-mail">
        Messages caught by the local mail server (development and demo
        installations only; nothing is really sent).
      </PageHeader>
      {loaderData.error ? (
        <p className="text-danger">{loaderData.error}</p>
      ) : null}
      <ul className="space-y-4">
        {loaderData.messages.map((m) => (
          <li key={m.id} className="rounded-lg border border-line bg-panel p-4">
            <div className="text-sm text-ink-muted">
              {m.receivedAt} · to {m.to.join(", ")}
            </div>
            <div className="font-semibold">{m.subject}</div>
            <pre className="mt-2 text-sm whitespace-pre-wrap">
              {m.text.split(/(https?:\/\/\S+)/).map((part, i) =>
                /^https?:\/\//.test(part) ? (
                  <a key={i} href={part} className="text-accent underline">
                    {part}
                  </a>
                ) : (
                  part
                ),
              )}
            </pre>
          </li>
        ))}
        {loaderData.messages.length === 0 && !loaderData.error ? (
          <li className="text-ink-muted">No messages yet.</li>
        ) : null}
      </ul>
    </>
  );
}
