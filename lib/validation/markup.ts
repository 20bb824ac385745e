import { z } from "zod";
import { line, uuidSchema } from "./common";
import { distinctVertexCount, closeRing, signedRingArea, openRing } from "@/lib/geometry/measure";
import type { Position } from "@/lib/geometry/types";
import { MARKUP_KINDS, PAD_STATES, type MarkupKind } from "@/lib/markup/types";
import { UNKNOWN_DIE_LIMIT_UM } from "@/lib/markup/die-bounds";

/** Most positions one geometry may hold (all rings together, as sent). */
const MAX_VERTICES = 10_000;
/** Most shapes one POST may create. */
export const MAX_BATCH = 10_000;
/** A polygon's outer ring plus at most this many holes. */
const MAX_RINGS = 100;
/** Most saved estimates on one shape, and most values in one estimate. */
const MAX_ESTIMATES = 50;
const MAX_ESTIMATE_FIELDS = 32;

const coordinate = z
  .number({ error: (iss) => (iss.input === undefined ? "is required" : typeof iss.input === "number" ? "must be finite" : "must be a number") })
  .min(-UNKNOWN_DIE_LIMIT_UM, `must be within ±${UNKNOWN_DIE_LIMIT_UM} µm`)
  .max(UNKNOWN_DIE_LIMIT_UM, `must be within ±${UNKNOWN_DIE_LIMIT_UM} µm`);

const position = z.tuple([coordinate, coordinate], { error: "must be an [x, y] pair of numbers" });
const positions = (min: number, what: string) =>
  z
    .array(position, { error: "must be a list of [x, y] pairs" })
    .min(min, `${what} needs at least ${min} positions`)
    .max(MAX_VERTICES, `must have at most ${MAX_VERTICES} vertices`);

const pointSchema = (message: string) => z.strictObject({ type: z.literal("Point", { error: message }), coordinates: position });

const lineStringSchema = (message: string) =>
  z
    .strictObject({ type: z.literal("LineString", { error: message }), coordinates: positions(2, "a line") })
    .refine((g) => distinctVertexCount(g.coordinates) >= 2, { message: "a line needs at least 2 distinct points", path: ["coordinates"] });

const ringSchema = positions(3, "a ring").superRefine((ring, ctx) => {
  if (distinctVertexCount(ring) < 3) ctx.addIssue({ code: "custom", message: "a ring needs at least 3 distinct vertices" });
  else if (signedRingArea(openRing(ring)) === 0) ctx.addIssue({ code: "custom", message: "a ring must enclose an area (its vertices lie on one line)" });
});

/** Polygons: rings closed as RFC 7946 §3.1.6 requires (an open ring is closed here). */
const polygonSchema = (message: string) =>
  z
    .strictObject({
      type: z.literal("Polygon", { error: message }),
      coordinates: z
        .array(ringSchema, { error: "must be a list of rings" })
        .min(1, "a polygon needs an outer ring")
        .max(MAX_RINGS + 1, `a polygon may have at most ${MAX_RINGS} holes`),
    })
    .refine((g) => g.coordinates.reduce((n, r) => n + r.length, 0) <= MAX_VERTICES, {
      message: `must have at most ${MAX_VERTICES} vertices`,
      path: ["coordinates"],
    })
    .transform((g) => ({ type: "Polygon" as const, coordinates: g.coordinates.map((r) => closeRing(r as Position[])) }));

/** The geometry type each kind of markup has (as lib/markup/types.ts GeometryOf). */
const MARKUP_GEOMETRY_TYPE: Readonly<Record<MarkupKind, "Point" | "LineString" | "Polygon">> = {
  pad: "Polygon",
  wire_bond: "LineString",
  block: "Polygon",
  symmetry_axis: "LineString",
  trace: "LineString",
  ruler: "LineString",
  note: "Point",
  die_outline: "Polygon",
};

const KIND_WORDS: Record<MarkupKind, string> = {
  pad: "a pad",
  wire_bond: "a wire bond",
  block: "a block",
  symmetry_axis: "a symmetry axis",
  trace: "a trace",
  ruler: "a ruler",
  note: "a note",
  die_outline: "a die outline",
};

const mismatch = (kind: MarkupKind) => `${KIND_WORDS[kind]} needs a ${MARKUP_GEOMETRY_TYPE[kind]} geometry`;

/**
 * Any of the three geometry types, for a PATCH (its kind is checked once the shape is loaded).
 * The union picks its member by `type`, so the members' mismatch messages are never shown.
 */
export const anyGeometrySchema = z.discriminatedUnion("type", [pointSchema("unused"), lineStringSchema("unused"), polygonSchema("unused")], {
  error: (iss) => (iss.code === "invalid_union" ? "must be a GeoJSON Point, LineString or Polygon" : undefined),
});

const estimateKey = z.string().regex(/^[A-Za-z0-9_.:-]{1,64}$/, "keys are 1–64 letters, digits or _ . : -");
const estimateValue = z.union([z.number().finite(), z.string().max(200), z.boolean(), z.null()], {
  error: "must be a finite number, a string of at most 200 characters, true/false or null",
});
const savedEstimate = z
  .record(estimateKey, estimateValue)
  .refine((e) => Object.keys(e).length <= MAX_ESTIMATE_FIELDS, `an estimate holds at most ${MAX_ESTIMATE_FIELDS} values`);
/** Saved estimate results on any kind: a bounded record of flat records. */
const estimates = z
  .record(estimateKey, savedEstimate)
  .refine((e) => Object.keys(e).length <= MAX_ESTIMATES, `at most ${MAX_ESTIMATES} saved estimates`)
  .optional();

const label = line(200);
const positiveUm = (max: number) => z.number("must be a number").finite("must be finite").positive("must be positive").max(max, `must be at most ${max} µm`);

const PROPERTIES = {
  pad: z.strictObject({
    label: label.default(""),
    net: label.default(""),
    state: z.enum(PAD_STATES, `must be one of ${PAD_STATES.join(", ")}`).default("unbonded"),
    side: z.enum(["N", "E", "S", "W", ""], "must be one of N, E, S, W or empty").optional(),
    stateByHand: z.boolean("must be true or false").optional(),
    isPadOne: z.boolean("must be true or false").optional(),
    numberOutside: z.boolean("must be true or false").optional(),
    estimates,
  }),
  wire_bond: z.strictObject({ label: label.optional(), diameterUm: positiveUm(1000).default(25), padId: uuidSchema.nullable().optional(), estimates }),
  block: z.strictObject({ name: label.default(""), function: label.default(""), estimates }),
  symmetry_axis: z.strictObject({ name: label.optional(), label: label.optional(), estimates }),
  trace: z.strictObject({ label: label.optional(), widthUm: positiveUm(10_000), layerNote: label.optional(), estimates }),
  ruler: z.strictObject({ label: label.optional(), estimates }),
  note: z.strictObject({ text: z.string("must be text").trim().max(2000, "must be at most 2000 characters"), estimates }),
  die_outline: z.strictObject({ label: label.optional(), estimates }),
} as const;

function shapeOf<K extends MarkupKind, G extends z.ZodType, P extends z.ZodObject>(kind: K, geometry: G, properties: P) {
  return z.strictObject({
    id: uuidSchema.optional(),
    kind: z.literal(kind),
    geometry,
    // prefault: a missing properties object is parsed as {} so each kind's defaults apply.
    properties: properties.prefault({} as z.input<P>),
  });
}

/** One shape to create: `{ id?, kind, geometry, properties }`; geometry must match the kind. */
export const newShapeSchema = z.discriminatedUnion(
  "kind",
  [
    shapeOf("pad", polygonSchema(mismatch("pad")), PROPERTIES.pad),
    shapeOf("wire_bond", lineStringSchema(mismatch("wire_bond")), PROPERTIES.wire_bond),
    shapeOf("block", polygonSchema(mismatch("block")), PROPERTIES.block),
    shapeOf("symmetry_axis", lineStringSchema(mismatch("symmetry_axis")), PROPERTIES.symmetry_axis),
    shapeOf("trace", lineStringSchema(mismatch("trace")), PROPERTIES.trace),
    shapeOf("ruler", lineStringSchema(mismatch("ruler")), PROPERTIES.ruler),
    shapeOf("note", pointSchema(mismatch("note")), PROPERTIES.note),
    shapeOf("die_outline", polygonSchema(mismatch("die_outline")), PROPERTIES.die_outline),
  ],
  { error: (iss) => (iss.code === "invalid_union" ? `must be one of ${MARKUP_KINDS.join(", ")}` : undefined) },
);
export type NewShapeInput = z.infer<typeof newShapeSchema>;

/** PATCH /api/markup/{id}: the version the client last saw and what changes (properties are replaced whole). */
export const markupPatchSchema = z
  .strictObject({
    version: z.number("must be a number").int("must be a whole number").positive("must be positive"),
    geometry: anyGeometrySchema.optional(),
    properties: z.record(z.string(), z.unknown(), "must be an object").optional(),
  })
  .refine((p) => p.geometry !== undefined || p.properties !== undefined, { message: "send geometry or properties to change", path: ["geometry"] });
export type MarkupPatch = z.infer<typeof markupPatchSchema>;

/** `?version=` on DELETE: the version the client last saw. */
export const markupDeleteQuerySchema = z.strictObject({
  version: z.coerce.number("must be a number").int("must be a whole number").positive("must be positive").optional(),
});

/** `?padOne=<pad id>` on the pad table routes: the pad to number 1. */
export const padTableQuerySchema = z.strictObject({ padOne: uuidSchema.optional() });

/** `POST /api/dies/{dieId}/frame/restore`: the frame to go back to after a re-framing (undo). */
export const frameRestoreSchema = z.strictObject({
  originUm: position,
  widthUm: positiveUm(UNKNOWN_DIE_LIMIT_UM).nullable(),
  heightUm: positiveUm(UNKNOWN_DIE_LIMIT_UM).nullable(),
  outline: polygonSchema("must be a Polygon").nullable(),
});
