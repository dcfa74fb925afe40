import {
  extendZodWithOpenApi,
  OpenAPIRegistry,
} from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import {
  describeWarningCode,
  LOOKUP_REFUSAL_CODES,
  LOOKUP_WARNING_CODES,
  pointColumns,
} from "~/core/lookup";
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

/** Forms of a lookup answer: one object per point (the default), or arrays per field (large batches). */
const LOOKUP_FORMATS = ["points", "columns"] as const;
export type LookupFormat = (typeof LOOKUP_FORMATS)[number];

const LookupFields = z.object({
  property: PropertyKeySchema.optional().openapi({
    description:
      "One property; the answer carries its `results` at the top level. Give `property` or `properties`, not both.",
  }),
  properties: z
    .array(PropertyKeySchema)
    .min(1)
    .max(PROPERTY_KEYS.length)
    .optional()
    .openapi({
      description:
        "Several properties at the same points, each at most once; the answer lists one block per property under `lookups`, in this order, each block shaped as the answer to a one-property request (property, methodDescription, degree, units, results, summary).",
    }),
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
        "Conditions in the chosen unit system; pressures absolute, or gauge with `pressureBasis: gauge`. Messages count them from 1 (`Point 3` is the third point sent); the `issues` paths of a 400 count from 0, as JSON indices do.",
    }),
  method: MethodSchema.default("auto"),
  degree: Degree.optional(),
  units: UnitsParam,
  pressureBasis: PressureBasisParam,
  extrapolate: z.boolean().default(false).openapi({
    description:
      "Allow points outside the measured range; they are flagged `extrapolated`. Points too far out are still refused (`extrapolation-too-far`).",
  }),
  revision: z.number().int().positive().optional().openapi({
    description: "Revision number; default the latest approved one.",
  }),
  format: z.enum(LOOKUP_FORMATS).optional().openapi({
    description:
      "`points` (default): one object per point. `columns`: arrays per field, for large batches (the same as `Accept: application/vnd.isopleth.columns+json`). CSV is asked for with `Accept: text/csv`.",
  }),
});

type Issues = { path: (string | number)[]; message: string }[];

/** Exactly one of `property` and `properties`, and no property twice. */
function checkProperties(
  body: { property?: string; properties?: string[] },
  ctx: z.RefinementCtx,
) {
  if ((body.property === undefined) === (body.properties === undefined)) {
    ctx.addIssue({
      code: "custom",
      path: body.property === undefined ? ["property"] : ["properties"],
      message:
        body.property === undefined
          ? "Give `property` (one) or `properties` (a list)."
          : "Give `property` or `properties`, not both.",
    });
  }
  const seen = new Set<string>();
  body.properties?.forEach((p, i) => {
    if (seen.has(p))
      ctx.addIssue({
        code: "custom",
        path: ["properties", i],
        message: `${p} is listed twice; list each property once.`,
      });
    seen.add(p);
  });
}

export const LookupBody = LookupFields.strict()
  .superRefine(checkProperties)
  .openapi("LookupRequest", {
    description:
      "Give `property` or `properties` (exactly one). A malformed request (this schema not met, or a point that is not a point: not finite, an absolute pressure at or below zero, a temperature at or below absolute zero) is refused whole with 400; a well-formed point that cannot be served is refused on its own inside the 200 answer.",
  });
export type LookupBody = z.infer<typeof LookupBody>;

/*
 * The same contract, checked faster: zod validates everything but the points, and the points (up to 100,000)
 * are checked by a plain loop that reports the same field paths. LookupBody stays the documented schema.
 */
const LookupHead = LookupFields.omit({ points: true })
  .extend({
    points: z.array(z.unknown()).min(1).max(MAX_LOOKUP_POINTS),
  })
  .strict()
  .superRefine(checkProperties);

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

/*
 * A registered schema made nullable is written by the OpenAPI generator as allOf [$ref, {type: null}], which no
 * value can meet; a union with null is written anyOf [$ref, {type: "null"}], which says what we mean.
 */
const orNull = <T extends z.ZodType>(schema: T) => z.union([schema, z.null()]);

/** The method that produced a value (`pchip` where the automatic method fell back). */
const UsedMethodSchema = z.enum(["newton", "pchip", "linear"]);

const StencilSchema = z
  .object({
    pressure: z.array(z.number()).openapi({
      description:
        "Measured pressures of the data zone used (output units); on an oil grid it may include the bubble point itself.",
    }),
    temperature: z.array(z.number()).openapi({
      description:
        "Measured temperatures of the data zone used (output units).",
    }),
    columns: z
      .array(
        z.object({
          temperature: z.number().int().openapi({
            description: "Index of the grid's temperature column.",
          }),
          pressure: z.array(z.number().int()).openapi({
            description: "Indices of the grid rows this column used.",
          }),
          bubblePointNode: z.literal(true).optional().openapi({
            description:
              "The column's zone also used its bubble point (a node between two grid rows, not a grid cell).",
          }),
        }),
      )
      .optional()
      .openapi({
        description:
          "Present when the temperature columns of the zone used different rows (missing cells, bubble points): per column, its index and the grid rows it used, as indices into the sample's grid (`GET /api/v1/samples/{sampleId}`). Every listed cell is a measured one.",
      }),
  })
  .openapi("Stencil");

const RefusedSchema = z
  .object({
    code: z.enum(LOOKUP_REFUSAL_CODES),
    message: z.string().openapi({
      description:
        "In plain words, numbers in the request's units; points are counted from 1 (`Point 3` is the third point sent).",
    }),
  })
  .openapi("Refused", {
    description:
      "Why a point has no value: `outside-measured-range` (outside the measured pressures or temperatures, extrapolation not allowed), `no-measured-values` (cells around it were not measured: a hole, or beyond the last measured pressure of the neighbouring temperatures), `extrapolation-too-far` (farther outside the measured range than the extrapolation limit allows), `impossible-value` (the interpolation gave a physically impossible value there, e.g. Bo, Bg, viscosity, density or z at or below zero, Rs below zero, or no finite number at all). No NaN or Infinity is ever written.",
  });

const WarningSchema = z.enum(LOOKUP_WARNING_CODES).openapi("LookupWarning", {
  description: LOOKUP_WARNING_CODES.map(
    (c) => `\`${c}\`: ${describeWarningCode(c)}`,
  ).join(" "),
});

const LookupResultSchema = z
  .object({
    value: z.number().nullable().openapi({
      description: "In the output unit; null when the point is refused.",
    }),
    errorEstimate: z.number().nullable().openapi({
      description:
        "Estimated interpolation error (same unit as value); see the engine's documentation for what ± means. null when the point is refused, or when the table says nothing about the error at a served point (warning `estimate-unavailable`).",
    }),
    refused: RefusedSchema.optional().openapi({
      description:
        "Present only on a refused point (value, errorEstimate, method and stencil are then null).",
    }),
    warnings: z.array(WarningSchema),
    method: UsedMethodSchema.nullable().openapi({
      description:
        "Method that produced this value (`pchip` where the automatic method fell back); null when refused.",
    }),
    stencil: orNull(StencilSchema).openapi({
      description: "The measured nodes behind the value; null when refused.",
    }),
    branch: z.enum(["saturated", "undersaturated"]).optional(),
    bubblePointPressure: z.number().optional().openapi({
      description:
        "Oil grids: the bubble-point pressure at the point's temperature (output unit).",
    }),
  })
  .openapi("LookupResult");

const SummarySchema = z
  .object({
    count: z.number().int(),
    refusedCount: z.number().int(),
    refusalCounts: z.partialRecord(
      z.enum(LOOKUP_REFUSAL_CODES),
      z.number().int(),
    ),
    methodCounts: z.partialRecord(UsedMethodSchema, z.number().int()),
    warningCounts: z.partialRecord(WarningSchema, z.number().int()),
  })
  .openapi("LookupSummary", {
    description:
      "How many points were sent, how many were refused (and why), which methods served the others, and how many carry each warning.",
  });

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

const UnitsSchema = z.object({
  system: z.enum(OUTPUT_SYSTEMS),
  pressure: z.string().openapi({
    description: "psia or bara; psig or barg with `pressureBasis: gauge`.",
  }),
  temperature: z.string(),
  value: z.string(),
  ...BasisLabels,
});

const RequestHead = {
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
  method: MethodSchema,
};

const BlockHead = {
  property: PropertyKeySchema,
  methodDescription: z.string().openapi({
    description:
      "The method in words, with its degree, e.g. `automatic: newton [3,3], pchip where newton overshoots`.",
  }),
  degree: z.tuple([z.number().int(), z.number().int()]).nullable().openapi({
    description:
      "[along pressure, along temperature] degree of the polynomial method used; null for pchip.",
  }),
  units: UnitsSchema,
};

const LookupBlockSchema = z
  .object({
    ...BlockHead,
    results: z.array(LookupResultSchema).openapi({
      description:
        "One result per point, in the order sent; refused points in place.",
    }),
    summary: SummarySchema,
  })
  .openapi("LookupBlock", {
    description: "The answer for one property, one result per point.",
  });

export const LookupResponse = z
  .object({ ...RequestHead, ...LookupBlockSchema.shape })
  .openapi("LookupResponse", {
    description:
      "The answer to a request with `property`: the request's facts and the property's block.",
  });

export const LookupsResponse = z
  .object({ ...RequestHead, lookups: z.array(LookupBlockSchema) })
  .openapi("LookupsResponse", {
    description:
      "The answer to a request with `properties`: one block per property, in the order asked.",
  });

const LookupColumnsBlockSchema = z
  .object({
    ...BlockHead,
    count: z.number().int(),
    columns: z
      .object({
        value: z.array(z.number().nullable()),
        errorEstimate: z.array(z.number().nullable()),
        method: z.array(UsedMethodSchema.nullable()),
        warnings: z.array(z.array(WarningSchema)),
        refused: z.array(orNull(RefusedSchema)),
        branch: z
          .array(z.enum(["saturated", "undersaturated"]).nullable())
          .optional(),
        bubblePointPressure: z.array(z.number().nullable()).optional(),
      })
      .openapi({
        description:
          "Arrays of `count` entries, entry i for point i; the fields mean what they mean in a `LookupResult` (null where a point is refused, or where it has no error estimate).",
      }),
    summary: SummarySchema,
  })
  .openapi("LookupColumnsBlock", {
    description:
      "The answer for one property as arrays per field (no object per point). It leaves out the stencils, for speed: the per-point form gives them.",
  });

export const LookupColumnsResponse = z
  .object({
    ...RequestHead,
    format: z.literal("columns"),
    ...LookupColumnsBlockSchema.shape,
  })
  .openapi("LookupColumnsResponse");

export const LookupsColumnsResponse = z
  .object({
    ...RequestHead,
    format: z.literal("columns"),
    lookups: z.array(LookupColumnsBlockSchema),
  })
  .openapi("LookupsColumnsResponse");

const MAX_PRESSURES_CHARS = 6_000;
const ABSOLUTE_ZERO = { field: -459.67, metric: -273.15 } as const;

/*
 * The table's query. Every parameter may be left out: the temperature defaults to the sample's reservoir
 * temperature and the pressures to the measured ones (app/.server/api/table.ts). Each refusal names the
 * parameter and says in plain words what was expected.
 */
const TABLE_FORMATS = ["json", "csv", "text", "xlsx"] as const;
const TABLE_METHODS = ["auto", "newton", "pchip", "linear"] as const;
const quotedValue = (input: unknown) =>
  typeof input === "string" ? `“${input.slice(0, 40)}”` : "nothing";
export const TableQuery = z
  .object({
    temperature: DecimalParam.optional().openapi({
      example: "212",
      description:
        "Temperature of the table (°F field, °C metric), a plain decimal above absolute zero. Default: the sample's reservoir temperature (a 400 `invalid_query` names the parameter when the sample has none on record).",
    }),
    pressures: z
      .string()
      .min(1, "Give at least one pressure, e.g. 500,1000,1500 or 500:5000:250.")
      .max(
        MAX_PRESSURES_CHARS,
        `At most ${MAX_PRESSURES_CHARS} characters; use a range start:stop:step for long tables.`,
      )
      .optional()
      .openapi({
        example: "500:5000:250",
        description:
          "A list `a,b,c` or `start:stop:step` (absolute pressure; gauge with `pressureBasis=gauge`, then above 0 psig/barg). Default: the measured pressures of the table's grids (without extrapolation, those every grid covers), plus the bubble point as always.",
      }),
    units: z
      .enum(OUTPUT_SYSTEMS, {
        error: (i) => `Choose field or metric; got ${quotedValue(i.input)}.`,
      })
      .default("field")
      .openapi({
        description:
          "Unit system of inputs and outputs. field: psia, °F, rb/STB, scf/STB, ft³/scf, cP. metric: bara, °C, rm³/sm³, sm³/sm³ (15 °C, 101.325 kPa), mPa·s.",
      }),
    pressureBasis: PressureBasisParam,
    format: z
      .enum(TABLE_FORMATS, {
        error: (i) =>
          `Choose json, csv, text or xlsx; got ${quotedValue(i.input)}.`,
      })
      .default("json")
      .openapi({
        description:
          "json (default), csv (ASCII headers for scripts), text (our plain layout) or xlsx (a spreadsheet download: headers in words with units, the notes and the caution above them).",
      }),
    method: z
      .enum(TABLE_METHODS, {
        error: (i) =>
          `Choose auto, newton, pchip or linear; got ${quotedValue(i.input)}.`,
      })
      .default("auto")
      .openapi({
        description:
          "auto = Newton divided differences (degree 3), with the shape-preserving pchip value wherever Newton overshoots the data; or newton, pchip, linear.",
      }),
    revision: RevisionParam,
    extrapolate: z
      .enum(["true", "false"], {
        error: (i) => `Write true or false; got ${quotedValue(i.input)}.`,
      })
      .default("false")
      .transform((v) => v === "true"),
  })
  .superRefine((q, ctx) => {
    const zero = ABSOLUTE_ZERO[q.units];
    if (q.temperature !== undefined && !(q.temperature > zero)) {
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
