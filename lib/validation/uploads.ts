import { z } from "zod";
import { uuidSchema } from "./common";

/**
 * The tus Upload-Metadata of a micrograph upload (tus 1.0.0 §Creation: key/base64-value
 * pairs). `dieId` and `filename` say where it goes and what it was called; every other key is
 * capture data, checked with the same `captureSchema` as the multipart form's fields.
 * `filetype` is what tus clients usually send along; it is ignored (the content decides).
 */
export const uploadTargetSchema = z.object({
  dieId: uuidSchema,
  filename: z.string("filename is required").min(1, "filename is required").max(1000, "filename is too long"),
  filetype: z.string().max(200).optional(),
});

/** Splits decoded tus metadata into the target and the capture fields (as multipart strings). */
export function splitUploadMetadata(metadata: Record<string, string | null | undefined>) {
  const fields: Record<string, string> = {};
  for (const [k, v] of Object.entries(metadata)) fields[k] = v ?? "";
  const { dieId, filename, filetype, ...capture } = fields;
  return { target: { dieId, filename, filetype }, capture };
}
