import {
  extendZodWithOpenApi,
  OpenAPIRegistry,
} from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { pointColumns } from "~/core/lookup";
import { REVISION_STATUSES } from "~/utils/sample-vocabulary";
import {
  keyWithAbbreviation,
  OUTPUT_SYSTEMS,
  PRESSURE_BASES,
  PROPERTY_KEYS,
  unitLabel,
} from "~/core/units";

extendZodWithOpenApi(z);

/** The zod schemas of the /api/v1 boundary; the OpenAPI document is generated from them (openapi.ts). */
export const registry = new OpenAPIRegistry();

const UnitsParam = z.enum(OUTPUT_SYSTEMS).default("field").openapi({
  description:
    "Unit system of inputs and outputs. field: psia, °F, rb/STB, scf/STB, ft³/scf, cP, lb/ft³. metric: bara, °C, rm³/sm³, sm³/sm³ (15 °C, 101.325 kPa), mPa·s, kg/m³.",
});
const PressureBasisParam = z.enum(PRESSURE_BASES).default("absolute").openapi({
  description:
    "Pressures in and out as absolute (psia, bara) or gauge (psig in field, barg in metric units). Gauge pressures are made absolute with the sample's recorded barometric pressure (`barometricPressurePsia` of the sample; default one atmosphere, 14.696 psia), named in the response's `units`.",
});
const PropertyKeySchema = z.enum(PROPERTY_KEYS).openapi("PropertyKey", {
  description: PROPERTY_KEYS.map(keyWithAbbreviation).join(", "),
});
const MethodSchema = z
  .enum(["auto", "newton", "pchip", "linear"])
  .openapi("Method", {
    description:
      "auto = Newton divided differences of the given degree (default [3,3]), with the shape-preserving pchip value wherever Newton overshoots the data.",
  });
const Degree = z
  .union([
    z.number().int().min(1).max(6),
    z.tuple([z.number().int().min(1).max(6), z.number().int().min(1).max(6)]),
  ])
  .openapi({
    description:
      "Polynomial degree for newton: one number, or [along pressure, along temperature]. Default 3.",
  });

/*
 * Path and query values arrive as text and are read strictly (app/.server/api/request.ts): an id is written
 * in plain decimal digits (no sign, leading zero, exponent, hex or fraction: `0x1`, `1e0`, `+1`, `01` and
 * `1.0` are refused), a number as a plain decimal such as 212 or -40.5.
 */
const IdParam = z
  .string()
  .regex(
    /^[1-9][0-9]{0,14}$/,
    "Expected a whole number written in decimal digits, e.g. 12 (no sign, leading zero, exponent or hex).",
  )
  .transform(Number)
  .openapi({ type: "string", pattern: "^[1-9][0-9]{0,14}$", example: "1" });

const DecimalParam = z
  .string()
  .max(32, "At most 32 characters.")
  .regex(
    /^-?[0-9]+(\.[0-9]+)?$/,
    "Expected a plain decimal number, e.g. 212 or -40.5 (no exponent, hex, units or thousands separators).",
  )
  .transform(Number)
  .openapi({
    type: "string",
    pattern: "^-?[0-9]+(\\.[0-9]+)?$",
    example: "212",
  });

export const SampleIdParams = z.object({ sampleId: IdParam });

const RevisionParam = IdParam.optional().openapi({
  description:
    "Revision number; default the latest approved one. Tokens (and people whose role may not read drafts) get approved revisions only (approved or superseded): a draft or rejected revision answers 404 `revision_not_found`, exactly as a number that does not exist, so unreleased work is neither served nor revealed. A signed-in engineer, lab lead or administrator may name a draft; the output then says it is unapproved (`revision.status`/`revisionStatus`, `approved: false`, the header Isopleth-Revision-Status, and a first line `# UNAPPROVED DRAFT: …` in CSV and text).",
});

export const SampleListQuery = z.object({ units: UnitsParam });
/** Endpoints without query parameters: any parameter is refused. */
export const NoQuery = z.object({});

export const SampleQuery = z.object({
  revision: RevisionParam,
  units: UnitsParam,
});

const MAX_LOOKUP_POINTS = 100_000;
export const LookupBody = z
  .object({
    property: PropertyKeySchema,
    points: z
      .array(
        z
          .object({
            pressure: z.number().finite(),
            temperature: z.number().finite(),
          })
          .strict(),
      )
      .min(1)
      .max(MAX_LOOKUP_POINTS)
      .openapi({
        description:
          "Conditions in the chosen unit system; pressures absolute, or gauge with `pressureBasis: gauge`.",
      }),
    method: MethodSchema.default("auto"),
    degree: Degree.optional(),
    units: UnitsParam,
    pressureBasis: PressureBasisParam,
    extrapolate: z.boolean().default(false).openapi({
      description:
        "Allow points outside the measured range; they are flagged `extrapolated`.",
    }),
    revision: z.number().int().positive().optional().openapi({
      description: "Revision number; default the latest approved one.",
    }),
  })
  .strict()
  .openapi("LookupRequest");
export type LookupBody = z.infer<typeof LookupBody>;

/*
 * The same contract, checked faster: zod validates everything but the points, and the points (up to 100,000)
 * are checked by a plain loop that reports the same field paths. LookupBody stays the documented schema.
 */
const LookupHead = LookupBody.omit({ points: true }).extend({
  points: z.array(z.unknown()).min(1).max(MAX_LOOKUP_POINTS),
});

type Issues = { path: (string | number)[]; message: string }[];

/** Validates everything of a lookup body but its points (checked by pointColumns); `count` points were sent. */
export function parseLookupHead(
  head: Record<string, unknown>,
  count: number,
):
  | { success: true; data: Omit<LookupBody, "points"> }
  | { success: false; issues: Issues } {
  const input =
    "points" in head ? head : { ...head, points: new Array<undefined>(count) };
  const parsed = LookupHead.safeParse(input);
  if (!parsed.success)
    return { success: false, issues: zodIssues(parsed.error) };
  const { points: _points, ...data } = parsed.data;
  return { success: true, data };
}

export function parseLookupBody(
  input: unknown,
): { success: true; data: LookupBody } | { success: false; issues: Issues } {
  const head = LookupHead.safeParse(input);
  if (!head.success) return { success: false, issues: zodIssues(head.error) };
  const columns = pointColumns(head.data.points);
  if (!columns.ok) return { success: false, issues: columns.issues };
  return { success: true, data: head.data as LookupBody };
}

const StencilSchema = z.object({
  pressure: z.array(z.number()).openapi({
    description: "Measured pressures of the data zone used (output units).",
  }),
  temperature: z.array(z.number()).openapi({
    description: "Measured temperatures of the data zone used (output units).",
  }),
});

const RefusalSchema = z
  .object({
    code: z.literal("not_computable"),
    message: z.string(),
  })
  .openapi("Refusal", {
    description:
      "Why a point has no value: the interpolation did not give a finite number (e.g. far beyond the measured range with extrapolation allowed). No NaN or Infinity is ever written; such a point gets value null, errorEstimate null and this refusal, and the other points are served.",
  });

const LookupResultSchema = z
  .object({
    value: z.number().nullable().openapi({
      description:
        "In the output unit; null only when the point is refused (see refusal).",
    }),
    errorEstimate: z.number().nullable().openapi({
      description:
        "Estimated interpolation error (same unit as value), never zero; see the engine's documentation. null when refused.",
    }),
    refusal: RefusalSchema.optional(),
    warnings: z.array(z.string()).openapi({
      description:
        "Machine codes, e.g. extrapolated, overshoot, near-bubble-point, missing-cells.",
    }),
    method: z
      .string()
      .openapi({ description: "Method that produced this value." }),
    stencil: StencilSchema,
    branch: z.enum(["saturated", "undersaturated"]).optional(),
    bubblePointPressure: z.number().optional(),
  })
  .openapi("LookupResult");

/** The bases of the numbers of a lookup or a table (units block). */
const BasisLabels = {
  standardConditions: z.string().openapi({
    description:
      "Standard conditions the gas volumes of Rs and Bg are given on: those of the unit system (field 60 °F, 14.696 psia; metric 15 °C, 101.325 kPa).",
  }),
  reportStandardConditions: z.string().openapi({
    description:
      "The laboratory report's own standard conditions (recorded with the sample), from which Rs and Bg were rebased to `standardConditions` as an ideal gas (V ∝ T/p at standard conditions; the stock-tank oil volume is not rebased).",
  }),
  pressureBasis: z.enum(PRESSURE_BASES),
  barometricPressurePsia: z.number().openapi({
    description:
      "The sample's barometric pressure, psia: gauge pressure + this = absolute pressure.",
  }),
};

export const LookupResponse = z
  .object({
    sampleId: z.number(),
    revision: z.number(),
    revisionStatus: z.enum(REVISION_STATUSES).openapi({
      description:
        "Status of the revision used; anything but approved or superseded is an unapproved draft.",
    }),
    approved: z.boolean().openapi({
      description:
        "false for an unapproved (draft or rejected) revision, which only signed-in people may ask for.",
    }),
    property: PropertyKeySchema,
    method: MethodSchema,
    methodDescription: z.string().openapi({
      description:
        "The method in words, with its degree, e.g. `automatic: newton [3,3], pchip where newton overshoots`.",
    }),
    degree: z.tuple([z.number().int(), z.number().int()]).nullable().openapi({
      description:
        "[along pressure, along temperature] degree of the polynomial method used; null for pchip.",
    }),
    units: z.object({
      system: z.enum(OUTPUT_SYSTEMS),
      pressure: z.string().openapi({
        description: "psia or bara; psig or barg with `pressureBasis: gauge`.",
      }),
      temperature: z.string(),
      value: z.string(),
      ...BasisLabels,
    }),
    results: z.array(LookupResultSchema),
  })
  .openapi("LookupResponse");

const MAX_PRESSURES_CHARS = 6_000;
const ABSOLUTE_ZERO = { field: -459.67, metric: -273.15 } as const;

export const TableQuery = z
  .object({
    temperature: DecimalParam.openapi({
      example: "212",
      description:
        "Temperature of the table (°F field, °C metric), a plain decimal above absolute zero.",
    }),
    pressures: z
      .string()
      .min(1)
      .max(
        MAX_PRESSURES_CHARS,
        `At most ${MAX_PRESSURES_CHARS} characters; use a range start:stop:step for long tables.`,
      )
      .openapi({
        example: "500:5000:250",
        description:
          "A list `a,b,c` or `start:stop:step` (absolute pressure; gauge with `pressureBasis=gauge`, then above 0 psig/barg).",
      }),
    units: UnitsParam,
    pressureBasis: PressureBasisParam,
    format: z.enum(["json", "csv", "text"]).default("json"),
    method: MethodSchema.default("auto"),
    revision: RevisionParam,
    extrapolate: z
      .enum(["true", "false"])
      .default("false")
      .transform((v) => v === "true"),
  })
  .superRefine((q, ctx) => {
    const zero = ABSOLUTE_ZERO[q.units];
    if (!(q.temperature > zero)) {
      ctx.addIssue({
        code: "custom",
        path: ["temperature"],
        message: `${q.temperature} is at or below absolute zero (${zero} ${unitLabel(q.units, "temperature")}).`,
      });
    }
  });
export type TableQuery = z.output<typeof TableQuery>;

export const ProblemSchema = z
  .object({
    type: z.string(),
    title: z.string(),
    status: z.number(),
    detail: z.string(),
    code: z.string(),
    issues: z
      .array(
        z.object({
          path: z.array(z.union([z.string(), z.number()])),
          message: z.string(),
        }),
      )
      .optional(),
  })
  .openapi("Problem", {
    description: "RFC 9457 problem details (application/problem+json).",
  });

const SampleSummarySchema = z
  .object({
    id: z.number(),
    label: z.string(),
    field: z.string(),
    well: z.string(),
    sampleType: z.string(),
    reservoirTemperature: z.number().nullable(),
    reservoirPressure: z.number().nullable(),
    bubblePoint: z.number().nullable().openapi({
      description:
        "Bubble point at (or nearest measured to) the reservoir temperature.",
    }),
    approvedRevision: z.number().nullable(),
    properties: z.array(PropertyKeySchema),
  })
  .openapi("SampleSummary");

export const SampleListResponse = z
  .object({
    units: z.object({
      system: z.enum(OUTPUT_SYSTEMS),
      pressure: z.string(),
      temperature: z.string(),
    }),
    samples: z.array(SampleSummarySchema),
  })
  .openapi("SampleList");

const GridSchema = z
  .object({
    property: PropertyKeySchema,
    unit: z.string(),
    laboratoryUnit: z.string().nullable(),
    pressures: z.array(z.number()),
    temperatures: z.array(z.number()),
    values: z.array(z.array(z.number().nullable())).openapi({
      description:
        "values[i][j] at pressures[i], temperatures[j]; null = not measured.",
    }),
    bubblePoints: z.array(z.number().nullable()).optional(),
  })
  .openapi("Grid");

export const SampleDetailResponse = z
  .object({
    sample: z.record(z.string(), z.unknown()),
    revision: z.object({
      number: z.number(),
      status: z.enum(REVISION_STATUSES),
      approved: z.boolean().openapi({
        description:
          "false for an unapproved revision (only signed-in people whose role allows it may ask for one).",
      }),
    }),
    units: z.object({
      system: z.enum(OUTPUT_SYSTEMS),
      pressure: z.string(),
      temperature: z.string(),
      standardConditions: BasisLabels.standardConditions,
      reportStandardConditions: BasisLabels.reportStandardConditions,
    }),
    bubblePoints: z.array(
      z.object({ temperature: z.number(), pressure: z.number() }),
    ),
    grids: z.array(GridSchema),
  })
  .openapi("SampleDetail");

/** zod issues → the `issues` member of a 400 problem. */
export function zodIssues(error: z.ZodError) {
  return error.issues.map((i) => ({
    path: i.path.map((p) => (typeof p === "symbol" ? String(p) : p)),
    message: i.message,
  }));
}
