import { MAX_JSON_DEPTH, readJsonText } from "~/.server/api/body";
import { requireApiCaller } from "~/.server/api/caller";
import { lookupResponse } from "~/.server/api/lookup";
import {
  describeIssues,
  parseApiPath,
  parseApiQuery,
} from "~/.server/api/request";
import {
  NoQuery,
  parseLookupHead,
  SampleIdParams,
} from "~/.server/api/schemas";
import {
  requireRevisionData,
  requireSampleForCaller,
} from "~/.server/api/samples";
import { problem } from "~/.server/http";
import { runHeavy } from "~/.server/workers/pool";
import type { Route } from "./+types/lookup";

/**
 * POST /api/v1/samples/:sampleId/lookup — interpolate one property (or several) at up to 100,000 conditions;
 * every point is answered or refused in place (app/.server/api/lookup.ts).
 */
export async function action(args: Route.ActionArgs) {
  const startedAt = performance.now();
  if (args.request.method !== "POST")
    return problem(405, "method_not_allowed", "Use POST.", {
      headers: { Allow: "POST" },
    });
  const caller = await requireApiCaller(args, "lookup");
  const { sampleId } = parseApiPath(args.params, SampleIdParams);
  parseApiQuery(args.request, NoQuery);
  const text = await readJsonText(args.request);
  // Parsing and checking a large body (3.5 MB for 100,000 points) runs in a worker thread, off the event loop.
  const read = await runHeavy("read-lookup-body", {
    text,
    maxDepth: MAX_JSON_DEPTH,
  });
  const readMs = performance.now() - startedAt;
  if (!read.ok)
    return problem(
      400,
      "invalid_body",
      read.message,
      read.issues ? { issues: read.issues } : undefined,
    );
  const head = parseLookupHead(read.head, read.count);
  if (!head.success)
    return problem(
      400,
      "invalid_body",
      `The lookup request is not valid: ${describeIssues(head.issues)}`,
      { issues: head.issues },
    );
  const sample = await requireSampleForCaller(caller, sampleId);
  const data = await requireRevisionData(caller, sample, head.data.revision);
  const body = {
    ...head.data,
    pressures: read.pressures,
    temperatures: read.temperatures,
    sample,
  };
  return lookupResponse(
    args.request,
    sample.id,
    data,
    body,
    startedAt,
    readMs,
    text,
  );
}

export async function loader() {
  return problem(405, "method_not_allowed", "Use POST with a JSON body.", {
    headers: { Allow: "POST" },
  });
}
