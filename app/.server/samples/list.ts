import { searchSamples } from "~/.server/db/queries/samples";
import { type OutputSystem, unitLabel } from "~/core/units";
import type { SampleListQuery } from "~/components/samples/list-query";
import type { SampleListView } from "~/components/samples/sample-list";
import { can, type Role } from "~/utils/permissions";
import { presentSample } from "./present";

/** One page of the samples list, with each sample's reservoir conditions in the reader's units. */
export async function loadSampleList(
  query: SampleListQuery,
  pageSize: number,
  user: { role: Role; unitSystem: OutputSystem },
): Promise<SampleListView> {
  const { total, rows } = await searchSamples({ ...query, pageSize });
  const system = user.unitSystem;
  return {
    query,
    total,
    first: total === 0 ? 0 : (query.page - 1) * pageSize + 1,
    last: Math.min(total, query.page * pageSize),
    pageCount: Math.max(1, Math.ceil(total / pageSize)),
    canCreate: can(user, "edit:samples"),
    units: {
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
    },
    rows: rows.map((r) => {
      const shown = presentSample(r, system);
      return {
        id: r.id,
        label: r.label,
        sampleType: r.sampleType,
        samplingDate: r.samplingDate,
        fieldName: r.fieldName,
        wellName: r.wellName,
        laboratory: r.laboratory,
        reservoirPressure: shown.reservoirPressure,
        reservoirTemperature: shown.reservoirTemperature,
        approvedRevision: r.approvedRevision,
        drafts: r.drafts,
      };
    }),
  };
}
