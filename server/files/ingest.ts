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
import { micrographPaths } from "./storage-paths";
import { notifyJobs } from "../jobs/queue";

/**
 * Accepts a received micrograph file: validates the capture data, checks the file arrived
 * whole and its header (format, pixel count under the cap, before any decoding), then records
 * it and queues tiling in one transaction while moving the file into originals/. Any refusal
 * deletes the file; nothing is left behind. The upload route and the demo seed both come here.
 */
export async function ingestMicrograph(
  db: Database,
  actor: Actor,
  dieId: string,
  file: { tempPath: string; bytes: number; format: RasterFormat; clientName: string },
  fields: Record<string, string>,
): Promise<MicrographDto> {
  const id = crypto.randomUUID();
  let finalPath: string | null = null;
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
    const paths = micrographPaths(dieId, id, probe.format);
    finalPath = paths.original!;
    await fs.mkdir(paths.originalsDir, { recursive: true });
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
      await fs.rename(file.tempPath, finalPath!);
    });
  } catch (e) {
    await fs.rm(file.tempPath, { force: true });
    if (finalPath) await fs.rm(finalPath, { force: true });
    throw e;
  }
  notifyJobs();
  return getMicrograph(db, actor, id);
}
