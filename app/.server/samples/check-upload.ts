import { createHash } from "node:crypto";
import type { NewRevision } from "~/.server/db/queries/revisions";
import { runHeavy } from "~/.server/workers/pool";
import {
  displayFileName,
  qcStatus,
  type Finding,
  type ParsedDataset,
  type QcMeta,
} from "~/core/lab-data";
import { PROPERTY_KEYS } from "~/core/units";
import type { StoredQcReport } from "./qc-report";
import type { CanonicalBubblePoint, CanonicalGrid } from "./present";

/*
 * One uploaded file, checked: parsed (long or grid layout, CSV or XLSX) and, when it parses, put through the
 * physical QC checks with the sample's own data (API gravity, gas gravity, standard conditions). The preview and
 * the confirmation both call this, so what is stored is exactly what was checked on the server.
 */

export type SampleForQc = {
  stockTankApi: number | null;
  gasSpecificGravity: number | null;
  standardPressurePsia: number;
  standardTemperatureF: number;
  /** Makes the file's gauge pressures (psig, barg…) absolute; default one atmosphere. */
  barometricPressurePsia?: number;
};

export type CheckedUpload =
  | {
      ok: false;
      fileName: string;
      sha256: string;
      sizeBytes: number;
      errors: readonly Finding[];
      warnings: readonly Finding[];
    }
  | {
      ok: true;
      fileName: string;
      sha256: string;
      sizeBytes: number;
      dataset: ParsedDataset;
      /** Warnings and notes about the file (decimal comma, encoding…). */
      fileFindings: readonly Finding[];
      /** Findings of the physical checks, errors first. */
      findings: readonly Finding[];
      meta: QcMeta;
      status: "pass" | "warn" | "fail";
    };

export function qcMetaOf(sample: SampleForQc): QcMeta {
  return {
    ...(sample.stockTankApi !== null
      ? { apiGravity: sample.stockTankApi }
      : {}),
    ...(sample.gasSpecificGravity !== null
      ? { gasGravity: sample.gasSpecificGravity }
      : {}),
    standardConditions: {
      pressurePsia: sample.standardPressurePsia,
      temperatureF: sample.standardTemperatureF,
    },
    ...(sample.barometricPressurePsia !== undefined
      ? { barometricPsia: sample.barometricPressurePsia }
      : {}),
  };
}

function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

export async function checkUpload(
  file: { name: string; bytes: Uint8Array },
  sample: SampleForQc,
): Promise<CheckedUpload> {
  const fileName = displayFileName(file.name);
  const sha256 = sha256Hex(file.bytes);
  const sizeBytes = file.bytes.byteLength;
  const meta = qcMetaOf(sample);
  // Parsing and QC run in a worker thread for a large file (app/.server/workers); busy → a 503 page.
  const parsed = await runHeavy(
    "check-upload",
    { filename: file.name, bytes: file.bytes, meta },
    { surface: "page" },
  );
  if (!parsed.ok)
    return {
      ok: false,
      fileName,
      sha256,
      sizeBytes,
      errors: parsed.errors,
      warnings: parsed.warnings,
    };
  const findings = parsed.findings;
  const status = qcStatus([...parsed.warnings, ...findings]);
  return {
    ok: true,
    fileName,
    sha256,
    sizeBytes,
    dataset: parsed.dataset,
    fileFindings: parsed.warnings,
    findings,
    meta,
    status,
  };
}

/** The parsed grids in the shape shared by previews and stored revisions (canonical units). */
export function canonicalGridsOf(dataset: ParsedDataset): CanonicalGrid[] {
  return PROPERTY_KEYS.flatMap((key) => {
    const g = dataset.properties[key];
    if (!g) return [];
    return [
      {
        property: key,
        sourceUnit: g.unit.id,
        pressures: [...g.pressures],
        temperatures: [...g.temperatures],
        values: g.values.map((row) => [...row]),
      },
    ];
  });
}

export function bubblePointsOf(dataset: ParsedDataset): CanonicalBubblePoint[] {
  return dataset.bubblePoints.map((b) => ({
    temperatureF: b.temperature,
    bubblePointPsia: b.pressure,
  }));
}

/** The revision to store for a checked upload: grids in canonical units with the lab's units remembered. */
export function revisionFromUpload(
  checked: Extract<CheckedUpload, { ok: true }>,
  input: { sampleId: number; createdBy: number; comment: string | null },
): NewRevision & { createdBy: number } {
  const report: StoredQcReport = {
    version: 1,
    status: checked.status,
    checkedAt: new Date().toISOString(),
    file: {
      name: checked.fileName,
      format: checked.dataset.file?.format ?? "csv",
      layout: checked.dataset.file?.layout ?? "long",
      sizeBytes: checked.sizeBytes,
    },
    meta: checked.meta,
    fileFindings: [...checked.fileFindings],
    findings: [...checked.findings],
  };
  return {
    sampleId: input.sampleId,
    comment: input.comment,
    sourceFilename: checked.fileName,
    sourceSha256: checked.sha256,
    qcReport: report,
    createdBy: input.createdBy,
    bubblePoints: bubblePointsOf(checked.dataset),
    grids: PROPERTY_KEYS.flatMap((key) => {
      const g = checked.dataset.properties[key];
      if (!g) return [];
      return [
        {
          property: key,
          unit: g.canonicalUnit,
          sourceUnit: g.unit.id,
          pressures: [...g.pressures],
          temperatures: [...g.temperatures],
          values: g.values.map((row) => [...row]),
        },
      ];
    }),
  };
}
