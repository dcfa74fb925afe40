import { and, eq } from "drizzle-orm";
import { hashPassword } from "~/.server/auth/password";
import { generateSample } from "~/core/properties";
import {
  CANONICAL_UNITS,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
} from "~/core/units";
import { countRevisions, createRevision } from "./queries/revisions";
import type { Database } from "./client";
import {
  fields,
  samples,
  users,
  wells,
  type Role,
  type SampleType,
} from "./schema";
import { roundSignificant } from "~/core/format";

/*
 * Demo data for an INVENTED scenario: the Calder Shelf field, its wells and fluid samples do not exist.
 * No number here is a measurement. See reference-data/README.md.
 */

const DEMO_FIELD = {
  name: "Calder Shelf (demo)",
  region: "Invented offshore basin",
  description:
    "An invented field used to demonstrate Isopleth. Every well, sample and number in it is made up and is not a measurement.",
};

export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: "admin@calder.example", name: "Avery Admin", role: "admin" },
  { email: "lab@calder.example", name: "Lena Lablead", role: "lab_lead" },
  {
    email: "engineer@calder.example",
    name: "Ravi Reservoir",
    role: "engineer",
  },
  { email: "viewer@calder.example", name: "Mona Manager", role: "viewer" },
];

type DemoSample = {
  well: string;
  label: string;
  sampleType: SampleType;
  samplingDate: string;
  samplingDepthFt: number;
  reservoirPressurePsia: number;
  reservoirTemperatureF: number;
  stockTankApi: number;
  gasSpecificGravity: number;
  /** Bubble point at reservoir temperature the invented fluid is built around. */
  bubblePointPsia: number;
  /** Temperatures (°F) at which the invented laboratory "measured". */
  temperaturesF: number[];
  pressuresPsia: number[];
};

const PRESSURES_A = [
  400, 800, 1200, 1600, 2000, 2400, 2800, 3200, 3600, 4200, 4800, 5400,
];
const PRESSURES_B = [
  300, 700, 1100, 1500, 1900, 2300, 2700, 3100, 3500, 4000, 4500,
];

export const DEMO_WELLS = ["CS-1", "CS-2", "CS-3A", "CS-4"];

export const DEMO_SAMPLES: DemoSample[] = [
  {
    well: "CS-1",
    label: "CS-1 BH-01",
    sampleType: "bottomhole",
    samplingDate: "2024-03-14",
    samplingDepthFt: 9120,
    reservoirPressurePsia: 4650,
    reservoirTemperatureF: 212,
    stockTankApi: 34.5,
    gasSpecificGravity: 0.78,
    bubblePointPsia: 2650,
    temperaturesF: [150, 180, 212, 240],
    pressuresPsia: PRESSURES_A,
  },
  {
    well: "CS-1",
    label: "CS-1 SEP-02",
    sampleType: "separator_recombined",
    samplingDate: "2024-09-02",
    samplingDepthFt: 9120,
    reservoirPressurePsia: 4420,
    reservoirTemperatureF: 212,
    stockTankApi: 34.1,
    gasSpecificGravity: 0.8,
    bubblePointPsia: 2580,
    temperaturesF: [170, 212, 250],
    pressuresPsia: PRESSURES_A,
  },
  {
    well: "CS-2",
    label: "CS-2 BH-01",
    sampleType: "bottomhole",
    samplingDate: "2024-05-21",
    samplingDepthFt: 9480,
    reservoirPressurePsia: 4810,
    reservoirTemperatureF: 221,
    stockTankApi: 31.2,
    gasSpecificGravity: 0.82,
    bubblePointPsia: 2240,
    temperaturesF: [160, 190, 221, 250],
    pressuresPsia: PRESSURES_B,
  },
  {
    well: "CS-3A",
    label: "CS-3A MDT-01",
    sampleType: "formation_tester",
    samplingDate: "2025-01-09",
    samplingDepthFt: 8850,
    reservoirPressurePsia: 4380,
    reservoirTemperatureF: 204,
    stockTankApi: 38.6,
    gasSpecificGravity: 0.74,
    bubblePointPsia: 3120,
    temperaturesF: [140, 172, 204, 236, 268],
    pressuresPsia: PRESSURES_A,
  },
  {
    well: "CS-4",
    label: "CS-4 WH-01",
    sampleType: "wellhead",
    samplingDate: "2025-06-30",
    samplingDepthFt: 9900,
    reservoirPressurePsia: 5020,
    reservoirTemperatureF: 230,
    stockTankApi: 28.4,
    gasSpecificGravity: 0.85,
    bubblePointPsia: 1850,
    temperaturesF: [180, 205, 230],
    pressuresPsia: PRESSURES_B,
  },
];

type SeedOptions = { demoPassword: string };

/** Loads the demo scenario. Idempotent: rows that already exist (by name, e-mail or label) are left alone. */
export async function seedDemo(
  db: Database,
  options: SeedOptions,
): Promise<void> {
  const passwordHash = await hashPassword(options.demoPassword);
  await db.transaction(async (tx) => {
    for (const u of DEMO_USERS) {
      await tx
        .insert(users)
        .values({ ...u, passwordHash })
        .onDuplicateKeyUpdate({ set: { email: u.email } });
    }
    await tx
      .insert(fields)
      .values(DEMO_FIELD)
      .onDuplicateKeyUpdate({ set: { name: DEMO_FIELD.name } });
    const [field] = await tx
      .select({ id: fields.id })
      .from(fields)
      .where(eq(fields.name, DEMO_FIELD.name));
    if (!field) throw new Error("demo field missing after insert");

    const wellIds = new Map<string, number>();
    for (const name of DEMO_WELLS) {
      await tx
        .insert(wells)
        .values({ fieldId: field.id, name })
        .onDuplicateKeyUpdate({ set: { name } });
      const [well] = await tx
        .select({ id: wells.id })
        .from(wells)
        .where(and(eq(wells.fieldId, field.id), eq(wells.name, name)));
      if (!well) throw new Error(`demo well ${name} missing after insert`);
      wellIds.set(name, well.id);
    }

    for (const s of DEMO_SAMPLES) {
      const wellId = wellIds.get(s.well);
      if (wellId === undefined)
        throw new Error(`demo sample ${s.label} names unknown well ${s.well}`);
      await tx
        .insert(samples)
        .values({
          wellId,
          label: s.label,
          sampleType: s.sampleType,
          samplingDate: s.samplingDate,
          samplingDepthFt: s.samplingDepthFt,
          reservoirPressurePsia: s.reservoirPressurePsia,
          reservoirTemperatureF: s.reservoirTemperatureF,
          stockTankApi: s.stockTankApi,
          gasSpecificGravity: s.gasSpecificGravity,
          laboratory: "Invented laboratory (demo)",
          reportReference: `DEMO-${s.label.replace(/\s+/g, "-")}`,
          notes:
            "Invented demo sample: the numbers are generated, not measured.",
        })
        .onDuplicateKeyUpdate({ set: { label: s.label } });
    }
  });

  // Grids: generated from published correlations with a little seeded noise, so they look like laboratory
  // data without being any. Revision 1 is approved by the lab lead; existing revisions are never touched.
  const [labLead] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, "lab@calder.example"));
  for (const [index, s] of DEMO_SAMPLES.entries()) {
    const [sample] = await db
      .select({ id: samples.id })
      .from(samples)
      .innerJoin(wells, eq(wells.id, samples.wellId))
      .where(and(eq(wells.name, s.well), eq(samples.label, s.label)));
    if (!sample || (await countRevisions(sample.id, db)) > 0) continue;
    const generated = demoGrids(s, index + 1);
    await createRevision(
      {
        sampleId: sample.id,
        status: "approved",
        comment:
          "Demo revision generated from published correlations (invented data, not a measurement).",
        sourceFilename: `${s.label.replace(/\s+/g, "-")}-demo.csv`,
        createdBy: labLead?.id ?? null,
        reviewedBy: labLead?.id ?? null,
        reviewComment: "Demo data: approved by the seed.",
        ...generated,
      },
      db,
    );
  }
}

/** Relative standard deviation of the artificial noise: small enough that the invented tables keep the trends
 * the physics requires (and pass the QC checks), large enough that they do not look perfectly smooth. */
const DEMO_NOISE = 0.001;

/** The invented grids of one demo sample, in canonical units. */
export function demoGrids(s: DemoSample, seed: number, noise = DEMO_NOISE) {
  const generated = generateSample({
    apiGravity: s.stockTankApi,
    gasGravity: s.gasSpecificGravity,
    bubblePoint: s.bubblePointPsia,
    bubblePointTemperature: s.reservoirTemperatureF,
    temperatures: s.temperaturesF,
    pressures: s.pressuresPsia,
    noise,
    seed,
  });
  return {
    bubblePoints: generated.temperatures.map((temperatureF, j) => ({
      temperatureF,
      bubblePointPsia: Math.round(generated.bubblePoints[j]! * 10) / 10,
    })),
    grids: PROPERTY_KEYS.map((property) => {
      const grid = generated.grids[property];
      return {
        property,
        unit: CANONICAL_UNITS[PROPERTY_QUANTITIES[property]],
        sourceUnit: generated.units[property],
        pressures: grid.pressures,
        temperatures: grid.temperatures,
        values: grid.values.map((row) =>
          row.map((v) => (v === null ? null : roundSignificant(v, 5))),
        ),
      };
    }),
  };
}
