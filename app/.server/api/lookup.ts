import { isLookupError, runLookup, type LookupResult } from "~/core/lookup";
import { problem } from "~/.server/http";
import type { RevisionData } from "~/.server/samples/revision-data";
import { respondWithEtag } from "./respond";
import type { LookupBody } from "./schemas";

/** Runs a validated lookup against a revision and shapes the API response (or a problem). */
export function computeLookup(data: RevisionData, body: LookupBody): LookupResult | Response {
  const grid = data.grids[body.property];
  if (!grid) return problem(404, "property_not_measured", `Revision ${data.number} has no ${body.property} grid.`);
  try {
    return runLookup(grid, body.points, {
      property: body.property,
      method: body.method,
      degree: body.degree,
      extrapolate: body.extrapolate,
      units: body.units,
      messages: false,
    });
  } catch (error) {
    if (isLookupError(error)) {
      const status = error.code === "OUT_OF_RANGE" || error.code === "NO_VALID_ZONE" ? 422 : error.code === "INVALID_GRID" ? 500 : 400;
      const code = status === 422 ? "out_of_range" : status === 500 ? "internal_error" : "invalid_body";
      const index = typeof error.details.pointIndex === "number" ? error.details.pointIndex : undefined;
      return problem(status, code, error.message, index === undefined ? undefined : { issues: [{ path: ["points", index], message: error.message }] });
    }
    throw error;
  }
}

/** `startedAt` (performance.now() when the request arrived) gives the Server-Timing header. */
export function lookupResponse(request: Request, sampleId: number, data: RevisionData, body: LookupBody, startedAt = performance.now()): Response {
  const result = computeLookup(data, body);
  if (result instanceof Response) return result;
  const payload = JSON.stringify({
      sampleId,
      revision: data.number,
      property: body.property,
      method: body.method,
      methodDescription: result.methodDescription,
      degree: result.degree,
      units: {
        system: body.units,
        pressure: result.units.pressure.symbol,
        temperature: result.units.temperature.symbol,
        value: result.units.value.symbol,
      },
      results: result.results.map((r) => ({
        value: r.value,
        errorEstimate: r.errorEstimate,
        warnings: r.warnings,
        method: r.method,
        stencil: { pressure: r.stencil.pressures, temperature: r.stencil.temperatures, pressureIndices: r.stencil.pressureIndices, temperatureIndices: r.stencil.temperatureIndices },
        ...(r.branch ? { branch: r.branch } : {}),
        ...(r.bubblePointPressure !== null ? { bubblePointPressure: r.bubblePointPressure } : {}),
      })),
  });
  return respondWithEtag(request, payload, {
    contentType: "application/json; charset=utf-8",
    revision: data.number,
    headers: { "Server-Timing": `app;dur=${(performance.now() - startedAt).toFixed(1)}` },
  });
}
