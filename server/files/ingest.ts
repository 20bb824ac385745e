import "server-only";
import crypto from "node:crypto";
import fs from "node:fs/promises";
import { captureSchema } from "@/lib/validation/micrographs";
import { scaleFromCapture } from "@/lib/micrographs/scale";
import { probeImage } from "@/server/images/limits";
import { truncationReason } from "@/server/images/completeness";
import type { RasterFormat } from "@/lib/tiles/magic-bytes";
import { getMicrograph, insertMicrograph } from "@/server/access/micrographs";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { Actor } from "@/server/access/context";
import type { Database } from "@/db/client";
import { AppError } from "@/lib/errors";
import { env } from "../env";
import { zodFailure } from "../http/route";
import { micrographKeys } from "../storage/keys";
import { objectStore } from "../storage";
import { notifyJobs } from "../jobs/queue";

/**
 * Accepts a received micrograph file: validates the capture data, checks the file arrived
 * whole and its header (format, pixel count under the cap, before any decoding), then records
 * it in the object store under the original's key, then records it and queues tiling in one
 * transaction. Any refusal or failure deletes the temporary file and the stored object;
 * nothing is left behind. The upload route, the resumable uploads and the demo seed come here.
 */
export async function ingestMicrograph(
  db: Database,
  actor: Actor,
  dieId: string,
  file: { tempPath: string; bytes: number; format: RasterFormat; clientName: string },
  fields: Record<string, string>,
): Promise<MicrographDto> {
  const id = crypto.randomUUID();
  let stored: string | null = null;
  try {
    const parsed = captureSchema.safeParse(fields);
    if (!parsed.success) throw zodFailure(parsed.error, "capture data");
    const c = parsed.data;
    const truncated = await truncationReason(file.tempPath, file.format);
    if (truncated) throw new AppError(422, truncated);
    const probe = await probeImage(file.tempPath, env().KERFLINE_MAX_PIXELS);
    const scale =
      c.scaleUmPerPx ??
      (c.cameraPixelPitchUm && c.objectiveMag
        ? scaleFromCapture({ cameraPixelPitchUm: c.cameraPixelPitchUm, objectiveMag: c.objectiveMag, adapterMag: c.adapterMag })
        : null);
    stored = micrographKeys(dieId, id, probe.format).original!;
    await objectStore().putFile(stored, file.tempPath);
    await db.transaction(async (tx) => {
      await insertMicrograph(tx, actor, dieId, {
        id,
        label: c.label || file.clientName.replace(/\.[a-z0-9]+$/i, "") || "Micrograph",
        illumination: c.illumination,
        objectiveMag: c.objectiveMag,
        numericalAperture: c.numericalAperture,
        cameraPixelPitchUm: c.cameraPixelPitchUm,
        adapterMag: c.adapterMag,
        scaleUmPerPx: scale,
        width: probe.width,
        height: probe.height,
        format: probe.format,
        bytes: file.bytes,
        storedName: `${id}`,
        originalName: file.clientName,
      });
    });
  } catch (e) {
    await fs.rm(file.tempPath, { force: true });
    if (stored)
      await objectStore()
        .remove(stored)
        .catch(() => {});
    throw e;
  }
  // Stored (a hard link or a copy in local mode, an upload on S3): the temporary file goes.
  await fs.rm(file.tempPath, { force: true });
  notifyJobs();
  return getMicrograph(db, actor, id);
}
