import {
  boolean,
  date,
  double,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  int,
  text,
  timestamp,
  uniqueIndex,
  varchar,
  char,
} from "drizzle-orm/mysql-core";
import {
  PROPERTY_KEYS,
  type PropertyKey,
} from "../../../core/units/properties";
import { OUTPUT_SYSTEMS } from "../../../core/units/output";
import {
  REVISION_STATUSES,
  SAMPLE_TYPES,
  type RevisionStatus,
  type SampleType,
} from "../../../utils/sample-vocabulary";
import { users } from "./auth";
import { createdAt, id, ref, updatedAt } from "./columns";

/*
 * Measured values are stored in Isopleth's canonical field units (pressure psia, temperature °F,
 * depth ft; each property in the unit named by property_grids.unit). Column names carry their unit.
 */

export const fields = mysqlTable(
  "fields",
  {
    id: id(),
    name: varchar("name", { length: 120 }).notNull(),
    region: varchar("region", { length: 120 }),
    description: text("description"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("fields_name_unique").on(t.name)],
);

export const wells = mysqlTable(
  "wells",
  {
    id: id(),
    fieldId: ref("field_id")
      .notNull()
      .references(() => fields.id, { onDelete: "restrict" }),
    name: varchar("name", { length: 120 }).notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("wells_field_id_name_unique").on(t.fieldId, t.name)],
);

// Sample types and revision statuses are declared once in app/utils/sample-vocabulary.ts.
export { REVISION_STATUSES, SAMPLE_TYPES };
export type { RevisionStatus, SampleType };

export const samples = mysqlTable(
  "samples",
  {
    id: id(),
    wellId: ref("well_id")
      .notNull()
      .references(() => wells.id, { onDelete: "restrict" }),
    label: varchar("label", { length: 120 }).notNull(),
    sampleType: mysqlEnum("sample_type", SAMPLE_TYPES).notNull(),
    samplingDate: date("sampling_date", { mode: "string" }),
    samplingDepthFt: double("sampling_depth_ft"),
    reservoirPressurePsia: double("reservoir_pressure_psia"),
    reservoirTemperatureF: double("reservoir_temperature_f"),
    stockTankApi: double("stock_tank_api"),
    gasSpecificGravity: double("gas_specific_gravity"),
    standardPressurePsia: double("standard_pressure_psia")
      .notNull()
      .default(14.696),
    standardTemperatureF: double("standard_temperature_f")
      .notNull()
      .default(60),
    /** Makes the report's gauge pressures absolute (psig → psia); one atmosphere, 14.696 psia, unless stated. */
    barometricPressurePsia: double("barometric_pressure_psia")
      .notNull()
      .default(14.696),
    laboratory: varchar("laboratory", { length: 160 }),
    reportReference: varchar("report_reference", { length: 160 }),
    notes: text("notes"),
    createdBy: ref("created_by").references(() => users.id, {
      onDelete: "set null",
    }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("samples_well_id_label_unique").on(t.wellId, t.label)],
);

/** An immutable set of measured grids for one sample. Numbered 1, 2, 3… per sample. */
export const sampleRevisions = mysqlTable(
  "sample_revisions",
  {
    id: id(),
    sampleId: ref("sample_id")
      .notNull()
      .references(() => samples.id, { onDelete: "cascade" }),
    number: int("number", { unsigned: true }).notNull(),
    status: mysqlEnum("status", REVISION_STATUSES).notNull().default("draft"),
    comment: text("comment"),
    sourceFilename: varchar("source_filename", { length: 255 }),
    sourceSha256: char("source_sha256", { length: 64 }),
    qcReport: json("qc_report").$type<unknown>(),
    createdBy: ref("created_by").references(() => users.id, {
      onDelete: "set null",
    }),
    createdAt: createdAt(),
    reviewedBy: ref("reviewed_by").references(() => users.id, {
      onDelete: "set null",
    }),
    reviewedAt: timestamp("reviewed_at", { fsp: 3, mode: "date" }),
    reviewComment: text("review_comment"),
  },
  (t) => [
    uniqueIndex("sample_revisions_sample_id_number_unique").on(
      t.sampleId,
      t.number,
    ),
    index("sample_revisions_status_idx").on(t.status),
  ],
);

/** Bubble-point (saturation) pressure measured at one temperature, part of a revision. */
export const revisionBubblePoints = mysqlTable(
  "revision_bubble_points",
  {
    id: id(),
    revisionId: ref("revision_id")
      .notNull()
      .references(() => sampleRevisions.id, { onDelete: "cascade" }),
    temperatureF: double("temperature_f").notNull(),
    bubblePointPsia: double("bubble_point_psia").notNull(),
  },
  (t) => [
    uniqueIndex("revision_bubble_points_revision_id_temperature_f_unique").on(
      t.revisionId,
      t.temperatureF,
    ),
  ],
);

// Property keys are declared once in the property catalogue (app/core/units/properties.ts).
export { PROPERTY_KEYS };
export type { PropertyKey };

/** One property measured on a pressure–temperature grid within a revision. */
export const propertyGrids = mysqlTable(
  "property_grids",
  {
    id: id(),
    revisionId: ref("revision_id")
      .notNull()
      .references(() => sampleRevisions.id, { onDelete: "cascade" }),
    property: mysqlEnum("property", PROPERTY_KEYS).notNull(),
    /** Canonical unit the values are stored in. */
    unit: varchar("unit", { length: 32 }).notNull(),
    /** Unit the laboratory reported, remembered for display. */
    sourceUnit: varchar("source_unit", { length: 32 }),
    meta: json("meta").$type<Record<string, unknown>>(),
  },
  (t) => [
    uniqueIndex("property_grids_revision_id_property_unique").on(
      t.revisionId,
      t.property,
    ),
  ],
);

export const gridPoints = mysqlTable(
  "grid_points",
  {
    id: id(),
    gridId: ref("grid_id")
      .notNull()
      .references(() => propertyGrids.id, { onDelete: "cascade" }),
    pressurePsia: double("pressure_psia").notNull(),
    temperatureF: double("temperature_f").notNull(),
    value: double("value").notNull(),
  },
  (t) => [
    uniqueIndex("grid_points_grid_id_pressure_psia_temperature_f_unique").on(
      t.gridId,
      t.pressurePsia,
      t.temperatureF,
    ),
  ],
);

export type Field = typeof fields.$inferSelect;
export type Well = typeof wells.$inferSelect;
export type Sample = typeof samples.$inferSelect;
export type NewSample = typeof samples.$inferInsert;
export type SampleRevision = typeof sampleRevisions.$inferSelect;
export type PropertyGrid = typeof propertyGrids.$inferSelect;
export type GridPoint = typeof gridPoints.$inferSelect;

/** People who asked to be told by e-mail when a sample gets a newly approved revision. */
export const sampleFollows = mysqlTable(
  "sample_follows",
  {
    id: id(),
    sampleId: ref("sample_id")
      .notNull()
      .references(() => samples.id, { onDelete: "cascade" }),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("sample_follows_sample_id_user_id_unique").on(
      t.sampleId,
      t.userId,
    ),
  ],
);

/** A named set of conditions (e.g. a well's depletion path) that an engineer re-runs against a sample. */
export const lookupSets = mysqlTable(
  "lookup_sets",
  {
    id: id(),
    userId: ref("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    sampleId: ref("sample_id")
      .notNull()
      .references(() => samples.id, { onDelete: "cascade" }),
    name: varchar("name", { length: 120 }).notNull(),
    properties: json("properties").$type<PropertyKey[]>().notNull(),
    /** Conditions in canonical units (psia, °F). */
    conditions: json("conditions")
      .$type<{ pressurePsia: number; temperatureF: number }[]>()
      .notNull(),
    method: varchar("method", { length: 16 }).notNull(),
    degree: json("degree").$type<number | [number, number] | null>(),
    /** The unit system the set was saved in: its runs are computed and shown in it. */
    units: mysqlEnum("units", OUTPUT_SYSTEMS).notNull().default("field"),
    /** Whether its runs may extrapolate; sets saved before this was recorded are off (their points outside the data are refused). */
    extrapolate: boolean("extrapolate").notNull().default(false),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("lookup_sets_user_id_idx").on(t.userId)],
);

/** One point of a recorded run, as the lookup answered it (a refused point: no value, and why). */
export type LookupRunPoint = {
  value: number | null;
  errorEstimate: number | null;
  warnings: string[];
  /** The method used at this point (absent in runs recorded before it was kept). */
  method?: string | null;
  refused?: { code: string; message: string } | null;
};

/**
 * One run of a lookup set: which revision, with which settings (method, degree, extrapolation, unit system),
 * produced which values, in that unit system. Runs recorded before the settings were kept ran in field units
 * with extrapolation on, which is what the defaults of those columns say.
 */
export const lookupRuns = mysqlTable(
  "lookup_runs",
  {
    id: id(),
    setId: ref("set_id")
      .notNull()
      .references(() => lookupSets.id, { onDelete: "cascade" }),
    revisionId: ref("revision_id").references(() => sampleRevisions.id, {
      onDelete: "set null",
    }),
    revisionNumber: int("revision_number", { unsigned: true }).notNull(),
    method: varchar("method", { length: 16 }).notNull(),
    degree: json("degree").$type<number | [number, number] | null>(),
    extrapolate: boolean("extrapolate").notNull().default(true),
    units: mysqlEnum("units", OUTPUT_SYSTEMS).notNull().default("field"),
    /** Per property, the unit of its values as the lookup named it (null in runs recorded before). */
    valueUnits: json("value_units").$type<Record<string, string>>(),
    /** Per property, per condition: value null where the point was refused or could not be computed. */
    results: json("results")
      .$type<Record<string, LookupRunPoint[]>>()
      .notNull(),
    createdBy: ref("created_by").references(() => users.id, {
      onDelete: "set null",
    }),
    createdAt: createdAt(),
  },
  (t) => [index("lookup_runs_set_id_idx").on(t.setId)],
);

export type LookupSet = typeof lookupSets.$inferSelect;
export type LookupRun = typeof lookupRuns.$inferSelect;
