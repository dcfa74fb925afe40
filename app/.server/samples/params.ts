import { data } from "react-router";
import { getSampleWithPlace } from "~/.server/db/queries/samples";

/** The sample id of a URL, or a 404 for anything that is not a positive whole number. */
export function sampleIdFrom(params: { sampleId?: string }): number {
  const raw = params.sampleId ?? "";
  const id = Number(raw);
  if (!/^[1-9]\d{0,15}$/.test(raw) || !Number.isSafeInteger(id))
    throw data("There is no such sample.", { status: 404 });
  return id;
}

/** The sample with its well and field, or a 404. */
export async function requireSample(params: { sampleId?: string }) {
  const id = sampleIdFrom(params);
  const sample = await getSampleWithPlace(id);
  if (!sample) throw data(`There is no sample ${id}.`, { status: 404 });
  return sample;
}

/** A revision number from a URL or a query string, or null. */
export function revisionNumberFrom(
  raw: string | null | undefined,
): number | null {
  if (!raw || !/^[1-9]\d{0,8}$/.test(raw)) return null;
  return Number(raw);
}
