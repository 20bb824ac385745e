// Mosaics: a micrograph stitched from a grid of overlapping frames. The micrograph row stays the
// one the viewer, markup, alignment and exports read; this row keeps the grid and its registration.
import { boolean, doublePrecision, integer, jsonb, pgTable, text, uuid } from "drizzle-orm/pg-core";
import type { MosaicFrameDto, MosaicPairDto, MosaicStage } from "@/lib/dto/micrographs";
import { createdAt, updatedAt } from "./columns";
import { micrographs } from "./dies";

export const mosaics = pgTable("mosaics", {
  micrographId: uuid("micrograph_id")
    .primaryKey()
    .references(() => micrographs.id, { onDelete: "cascade" }),
  rows: integer("rows").notNull(),
  cols: integer("cols").notNull(),
  /** "rows" or "serpentine": the order the frames were captured (and uploaded) in. */
  order: text("order").$type<"rows" | "serpentine">().notNull(),
  overlapPercent: doublePrecision("overlap_percent").notNull(),
  flatField: boolean("flat_field").notNull(),
  frameWidth: integer("frame_width").notNull(),
  frameHeight: integer("frame_height").notNull(),
  /** The frames' stored format (all frames of a mosaic share size; their keys use its extension). */
  frameFormat: text("frame_format").notNull(),
  stage: text("stage").$type<MosaicStage>().notNull().default("checking"),
  stageProgress: integer("stage_progress").notNull().default(0),
  frames: jsonb("frames").$type<MosaicFrameDto[]>().notNull().default([]),
  pairs: jsonb("pairs").$type<MosaicPairDto[]>().notNull().default([]),
  residualRmsPx: doublePrecision("residual_rms_px"),
  residualMaxPx: doublePrecision("residual_max_px"),
  warnings: jsonb("warnings").$type<string[]>().notNull().default([]),
  /** Set while a stitch again runs beside a served result; cleared when it is swapped in. */
  restitching: boolean("restitching").notNull().default(false),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});
