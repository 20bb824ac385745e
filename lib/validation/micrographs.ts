import { z } from "zod";
import { line } from "./common";

export const ILLUMINATIONS = ["bright_field", "dark_field", "dic", "polarized", "ir", "other"] as const;
export const ILLUMINATION_LABELS: Record<(typeof ILLUMINATIONS)[number], string> = {
  bright_field: "Bright field",
  dark_field: "Dark field",
  dic: "DIC",
  polarized: "Polarized",
  ir: "IR",
  other: "Other",
};

/** Multipart fields arrive as strings: empty means "not given"; anything else must be a number. */
const optionalNumber = (label: string, max: number, { allowZero = false } = {}) =>
  z.preprocess(
    (v) => (v === "" || v === undefined || v === null ? undefined : typeof v === "string" ? Number(v.trim() === "" ? NaN : v) : v),
    z
      .number(`${label} must be a number`)
      .finite(`${label} must be a number`)
      .refine((n) => (allowZero ? n >= 0 : n > 0), `${label} must be positive`)
      .refine((n) => n <= max, `${label} must be at most ${max}`)
      .optional(),
  );

/** Capture data sent with an upload (multipart fields). */
export const captureSchema = z
  .strictObject({
    label: line(200).optional(),
    illumination: z.enum(ILLUMINATIONS, "illumination must be one of bright_field, dark_field, dic, polarized, ir, other").default("bright_field"),
    objectiveMag: optionalNumber("objectiveMag", 1000),
    numericalAperture: optionalNumber("numericalAperture", 1.7),
    cameraPixelPitchUm: optionalNumber("cameraPixelPitchUm", 100),
    adapterMag: optionalNumber("adapterMag", 10),
    scaleUmPerPx: optionalNumber("scaleUmPerPx", 1000),
  })
  .refine((c) => !(c.cameraPixelPitchUm && !c.objectiveMag), { message: "objectiveMag is needed with cameraPixelPitchUm", path: ["objectiveMag"] });

const finite = z.number().finite();
/** PATCH /api/micrographs/{id}: rename, set the scale, or calibrate by two points. */
export const micrographPatchSchema = z.strictObject({
  label: line(200).min(1, "a label is required").optional(),
  scaleUmPerPx: z.number().finite().positive("scaleUmPerPx must be positive").max(1000).optional(),
  calibration: z
    .strictObject({
      p1: z.tuple([finite, finite]),
      p2: z.tuple([finite, finite]),
      lengthUm: z.number().finite().positive("lengthUm must be positive").max(1_000_000),
    })
    .optional(),
});
export type MicrographPatch = z.infer<typeof micrographPatchSchema>;
