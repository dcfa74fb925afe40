import { readJsonBodyWithText } from "~/.server/api/body";
import { requireApiCaller } from "~/.server/api/caller";
import { lookupResponse } from "~/.server/api/lookup";
import { parseApiPath, parseApiQuery } from "~/.server/api/request";
import { NoQuery, parseLookupBody, SampleIdParams } from "~/.server/api/schemas";
import { requireRevisionData, requireSampleForCaller } from "~/.server/api/samples";
import { problem } from "~/.server/http";
import type { Route } from "./+types/lookup";

/** POST /api/v1/samples/:sampleId/lookup — interpolate one property at up to 100,000 conditions. */
export async function action(args: Route.ActionArgs) {
  const startedAt = performance.now();
  if (args.request.method !== "POST") return problem(405, "method_not_allowed", "Use POST.", { headers: { Allow: "POST" } });
  const caller = await requireApiCaller(args, "lookup");
  const { sampleId } = parseApiPath(args.params, SampleIdParams);
  parseApiQuery(args.request, NoQuery);
  const { value: raw, text } = await readJsonBodyWithText(args.request);
  const readMs = performance.now() - startedAt;
  const body = parseLookupBody(raw);
  if (!body.success) return problem(400, "invalid_body", "The lookup request is not valid; see issues.", { issues: body.issues });
  const sample = await requireSampleForCaller(caller, sampleId);
  const data = await requireRevisionData(caller, sample, body.data.revision);
  return lookupResponse(args.request, sample.id, data, body.data, startedAt, readMs, text);
}

export async function loader() {
  return problem(405, "method_not_allowed", "Use POST with a JSON body.", { headers: { Allow: "POST" } });
}
