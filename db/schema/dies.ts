// The work itself: cases, dies, their micrographs and the markup drawn on them.
import { boolean, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, uuid, bigint } from "drizzle-orm/pg-core";
import { ILLUMINATIONS, MARKUP_KINDS, MICROGRAPH_STATUSES, REVIEW_STATUSES } from "@/lib/dto/stored-values";
import type { Geometry, Transform } from "@/lib/geometry/types";
import type { ScaleCalibration } from "@/lib/dto/micrographs";
import type { StoredControlPoint } from "@/lib/dto/alignment";
import { createdAt, updatedAt } from "./columns";
import { users, teams } from "./people";

export const reviewStatusEnum = pgEnum("review_status", REVIEW_STATUSES);

export const illuminationEnum = pgEnum("illumination", ILLUMINATIONS);

export const micrographStatusEnum = pgEnum("micrograph_status", MICROGRAPH_STATUSES);

export const cases = pgTable(
  "cases",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    partMarking: text("part_marking").notNull().default(""),
    package: text("package").notNull().default(""),
    sampleId: text("sample_id").notNull().default(""),
    notes: text("notes").notNull().default(""),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("cases_team_idx").on(t.teamId)],
);

export const dies = pgTable(
  "dies",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    caseId: uuid("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    widthUm: doublePrecision("width_um"),
    heightUm: doublePrecision("height_um"),
    notes: text("notes").notNull().default(""),
    /** The engineer who reads the die; never its approver. */
    analystId: uuid("analyst_id").references(() => users.id, { onDelete: "set null" }),
    reviewStatus: reviewStatusEnum("review_status").notNull().default("draft"),
    /** The revision being drawn or checked (1 at first); earlier ones are in die_revisions. */
    revision: integer("revision").notNull().default(1),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("dies_case_idx").on(t.caseId)],
);

export const micrographs = pgTable(
  "micrographs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    label: text("label").notNull(),
    illumination: illuminationEnum("illumination").notNull().default("bright_field"),
    objectiveMag: doublePrecision("objective_mag"),
    numericalAperture: doublePrecision("numerical_aperture"),
    cameraPixelPitchUm: doublePrecision("camera_pixel_pitch_um"),
    adapterMag: doublePrecision("adapter_mag"),
    scaleUmPerPx: doublePrecision("scale_um_per_px"),
    width: integer("width"),
    height: integer("height"),
    /** 2x3 affine image px → die µm, `[[a, b, tx], [c, d, ty]]`; null until in the die frame. */
    transform: jsonb("transform").$type<Transform | null>(),
    status: micrographStatusEnum("status").notNull().default("queued"),
    progress: integer("progress").notNull().default(0),
    error: text("error"),
    /** Server-chosen file name under originals/; never the client's path. */
    storedName: text("stored_name"),
    format: text("format"),
    bytes: bigint("bytes", { mode: "number" }),
    position: integer("position").notNull().default(0),
    /** The micrograph that defines the die frame (the first of a die, until changed). */
    isReference: boolean("is_reference").notNull().default(false),
    /** Two-point calibration, when the scale came from one: image px and the known length. */
    calibration: jsonb("calibration").$type<ScaleCalibration | null>(),
    /** The client's file name, sanitised, for display only. */
    originalName: text("original_name"),
    /** Control-point pairs of the last alignment: image px ↔ die µm. */
    controlPoints: jsonb("control_points").$type<StoredControlPoint[] | null>(),
    alignmentModel: text("alignment_model"),
    /** The user said the photo really is mirrored (some camera set-ups mirror). */
    mirrored: boolean("mirrored").notNull().default(false),
    residualsUm: jsonb("residuals_um").$type<number[] | null>(),
    alignmentRmsUm: doublePrecision("alignment_rms_um"),
    previewWidth: integer("preview_width"),
    previewHeight: integer("preview_height"),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("micrographs_die_idx").on(t.dieId)],
);

export const markupKindEnum = pgEnum("markup_kind", MARKUP_KINDS);

/**
 * Markup of a die: GeoJSON-shaped geometry in the die frame (µm, origin lower-left, y up),
 * never in one micrograph's pixels. `version` starts at 1 and grows by one per change, so a
 * writer holding a stale copy is refused (optimistic concurrency) instead of overwriting.
 */
export const markup = pgTable(
  "markup",
  {
    /** Chosen by the client when it re-creates a shape (undo of a delete keeps the same id). */
    id: uuid("id").primaryKey().defaultRandom(),
    dieId: uuid("die_id")
      .notNull()
      .references(() => dies.id, { onDelete: "cascade" }),
    kind: markupKindEnum("kind").notNull(),
    geometry: jsonb("geometry").$type<Geometry>().notNull(),
    properties: jsonb("properties").$type<Record<string, unknown>>().notNull().default({}),
    version: integer("version").notNull().default(1),
    /** Insertion order: shapes of one batch share created_at, and lists keep the order they came in. */
    seq: bigint("seq", { mode: "number" }).generatedAlwaysAsIdentity(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("markup_die_seq_idx").on(t.dieId, t.seq)],
);
