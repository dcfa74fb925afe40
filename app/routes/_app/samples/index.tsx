import { requirePermission } from "~/.server/auth/guards";
import { listSamples } from "~/.server/db/queries/samples";
import { PageHeader } from "~/components/page-header";
import type { Route } from "./+types/index";

export const meta: Route.MetaFunction = () => [{ title: "Samples · Isopleth" }];

export async function loader(args: Route.LoaderArgs) {
  requirePermission(args, "read:samples");
  return { samples: await listSamples() };
}

const SAMPLE_TYPE_LABEL: Record<string, string> = {
  bottomhole: "Bottomhole",
  separator_recombined: "Separator, recombined",
  wellhead: "Wellhead",
  formation_tester: "Formation tester",
};

export default function Samples({ loaderData }: Route.ComponentProps) {
  const { samples } = loaderData;
  return (
    <>
      <PageHeader title="Samples">Fluid samples with laboratory results, by field and well.</PageHeader>
      <div className="overflow-x-auto rounded-lg border border-line bg-panel">
        <table className="w-full text-sm">
          <thead className="bg-surface text-left text-ink-muted">
            <tr>
              <th className="px-3 py-2 font-semibold">Field</th>
              <th className="px-3 py-2 font-semibold">Well</th>
              <th className="px-3 py-2 font-semibold">Sample</th>
              <th className="px-3 py-2 font-semibold">Type</th>
              <th className="px-3 py-2 font-semibold">Sampled</th>
              <th className="px-3 py-2 text-right font-semibold">Reservoir p (psia)</th>
              <th className="px-3 py-2 text-right font-semibold">Reservoir T (°F)</th>
              <th className="px-3 py-2 text-right font-semibold">Approved revision</th>
            </tr>
          </thead>
          <tbody>
            {samples.map((s) => (
              <tr key={s.id} className="border-t border-line">
                <td className="px-3 py-2">{s.fieldName}</td>
                <td className="px-3 py-2">{s.wellName}</td>
                <td className="px-3 py-2 font-semibold">{s.label}</td>
                <td className="px-3 py-2">{SAMPLE_TYPE_LABEL[s.sampleType] ?? s.sampleType}</td>
                <td className="px-3 py-2 tabular-nums">{s.samplingDate ?? "—"}</td>
                <td className="px-3 py-2 text-right tabular-nums">{s.reservoirPressurePsia ?? "—"}</td>
                <td className="px-3 py-2 text-right tabular-nums">{s.reservoirTemperatureF ?? "—"}</td>
                <td className="px-3 py-2 text-right tabular-nums">{s.approvedRevision ?? "none"}</td>
              </tr>
            ))}
            {samples.length === 0 ? (
              <tr>
                <td colSpan={8} className="px-3 py-6 text-center text-ink-muted">
                  No samples yet.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </>
  );
}
