import { openApiDocument, PROBLEM_CODES } from "~/.server/api/openapi";
import { requireUser } from "~/.server/auth/guards";
import { getEnv } from "~/.server/env";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [
  { title: "API documentation · Isopleth" },
];

type Operation = {
  summary?: string;
  description?: string;
  parameters?: {
    name: string;
    in: string;
    required?: boolean;
    description?: string;
    schema?: { type?: string; enum?: string[]; default?: unknown };
  }[];
  requestBody?: { content: Record<string, { schema: unknown }> };
  responses: Record<string, { description: string }>;
};
type Document = {
  paths: Record<string, Record<string, Operation>>;
  components?: { schemas?: Record<string, unknown> };
};

export async function loader(args: Route.LoaderArgs) {
  requireUser(args);
  const base = getEnv().APP_BASE_URL;
  return {
    doc: openApiDocument(base) as Document,
    problems: PROBLEM_CODES,
    base,
  };
}

export default function ApiDocs({ loaderData }: Route.ComponentProps) {
  const { doc, problems, base } = loaderData;
  return (
    <>
      <PageHeader title="API documentation">
        Version 1 of the Isopleth API, generated from the same schemas the
        server validates with. Machine-readable:{" "}
        <a className="text-accent underline" href="/api/v1/openapi.json">
          /api/v1/openapi.json
        </a>{" "}
        (OpenAPI 3.1). Create a token on the API tokens page and send it as{" "}
        <code>Authorization: Bearer &lt;token&gt;</code>.
      </PageHeader>
      <section className="rounded-lg border border-line bg-panel p-5 text-sm">
        <h2 className="font-semibold">Example</h2>
        <pre className="relative mt-2 overflow-x-auto rounded bg-surface p-3 text-xs">{`curl -H "Authorization: Bearer $TOKEN" "${base}/api/v1/samples"
curl -H "Authorization: Bearer $TOKEN" "${base}/api/v1/samples/1/table?temperature=212&pressures=500:5000:250&format=text"
curl -H "Authorization: Bearer $TOKEN" -H "Content-Type: application/json" \\
     -d '{"property":"oil_fvf","points":[{"pressure":3250,"temperature":212}]}' "${base}/api/v1/samples/1/lookup"`}</pre>
      </section>
      {Object.entries(doc.paths).map(([path, methods]) =>
        Object.entries(methods).map(([method, op]) => (
          <section
            key={`${method} ${path}`}
            className="mt-6 rounded-lg border border-line bg-panel p-5 text-sm"
          >
            <h2 className="font-mono text-base font-semibold">
              <span className="mr-2 rounded bg-accent-soft px-2 py-0.5 text-accent-strong uppercase">
                {method}
              </span>
              {path}
            </h2>
            <p className="mt-1 font-semibold">{op.summary}</p>
            {op.description ? (
              <p className="mt-1 text-ink-muted">{op.description}</p>
            ) : null}
            {op.parameters?.length ? (
              <div className="relative mt-3 overflow-x-auto">
                {" "}
                <table className="w-full">
                  <thead className="text-left text-ink-muted">
                    <tr>
                      <th className="py-1 pr-3 font-semibold">Parameter</th>
                      <th className="py-1 pr-3 font-semibold">In</th>
                      <th className="py-1 pr-3 font-semibold">Type</th>
                      <th className="py-1 font-semibold">Description</th>
                    </tr>
                  </thead>
                  <tbody>
                    {op.parameters.map((p) => (
                      <tr
                        key={`${p.in}-${p.name}`}
                        className="border-t border-line align-top"
                      >
                        <td className="py-1 pr-3 font-mono">
                          {p.name}
                          {p.required ? " *" : ""}
                        </td>
                        <td className="py-1 pr-3">{p.in}</td>
                        <td className="py-1 pr-3 font-mono text-xs">
                          {p.schema?.enum
                            ? p.schema.enum.join(" | ")
                            : (p.schema?.type ?? "")}
                        </td>
                        <td className="py-1">{p.description ?? ""}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ) : null}
            {op.requestBody ? (
              <details className="mt-3">
                <summary className="cursor-pointer font-semibold">
                  Request body (JSON schema)
                </summary>
                <pre className="mt-2 max-h-96 overflow-auto rounded bg-surface p-3 text-xs">
                  {JSON.stringify(
                    op.requestBody.content["application/json"]?.schema,
                    null,
                    2,
                  )}
                </pre>
              </details>
            ) : null}
            <p className="mt-3">
              <span className="font-semibold">Responses: </span>
              {Object.entries(op.responses)
                .map(([status, r]) => `${status} ${r.description}`)
                .join(" · ")}
            </p>
          </section>
        )),
      )}
      <section className="mt-6 rounded-lg border border-line bg-panel p-5 text-sm">
        <h2 className="font-semibold">Errors</h2>
        <p className="mt-1 text-ink-muted">
          Every error is a problem-details object (RFC 9457,{" "}
          <code>application/problem+json</code>) with <code>type</code>,{" "}
          <code>title</code>, <code>status</code>, <code>detail</code>, our{" "}
          <code>code</code>, and for invalid input the <code>issues</code> with
          field paths.
        </p>
        <dl className="mt-3 space-y-2">
          {Object.entries(problems).map(([code, text]) => (
            <div key={code} id={`problem-${code}`}>
              <dt className="font-mono font-semibold">{code}</dt>
              <dd className="text-ink-muted">{text}</dd>
            </div>
          ))}
        </dl>
      </section>
      {doc.components?.schemas ? (
        <details className="mt-6 rounded-lg border border-line bg-panel p-5 text-sm">
          <summary className="cursor-pointer font-semibold">Schemas</summary>
          <pre className="mt-2 max-h-[40rem] overflow-auto rounded bg-surface p-3 text-xs">
            {JSON.stringify(doc.components.schemas, null, 2)}
          </pre>
        </details>
      ) : null}
    </>
  );
}
