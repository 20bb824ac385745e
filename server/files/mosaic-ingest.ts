import "server-only";
import crypto from "node:crypto";
import { captureSchema } from "@/lib/validation/micrographs";
import { GRID_FIELDS, mosaicGridSchema } from "@/lib/validation/mosaics";
import { scaleFromCapture } from "@/lib/micrographs/scale";
import { probeImage } from "@/server/images/limits";
import { truncationReason } from "@/server/images/completeness";
import { getMicrograph, insertMicrograph } from "@/server/access/micrographs";
import { insertMosaic } from "@/server/access/mosaics";
import type { MicrographDto } from "@/lib/dto/micrographs";
import type { Actor } from "@/server/access/context";
import type { Database } from "@/db/client";
import { AppError, BadRequestError } from "@/lib/errors";
import { env } from "../env";
import { zodFailure } from "../http/route";
import { mosaicFrameKey } from "../storage/keys";
import { objectStore } from "../storage";
import { notifyJobs } from "../jobs/queue";
import { dropFrames, frameLabel, type ReceivedFrame } from "./mosaic-upload";

/** Frames smaller than this on a side leave no overlap strip worth correlating. */
const MIN_FRAME_SIDE = 64;

function splitFields(fields: Record<string, string>) {
  const grid: Record<string, string> = {};
  const capture: Record<string, string> = {};
  for (const [k, v] of Object.entries(fields)) ((GRID_FIELDS as readonly string[]).includes(k) ? grid : capture)[k] = v;
  return { grid, capture };
}

/** Every frame through the single upload's checks (arrived whole, header, pixel cap), then one size for all. */
async function checkFrames(frames: ReceivedFrame[]) {
  const cap = env().KERFLINE_MAX_PIXELS;
  let first: { width: number; height: number; format: string } | null = null;
  for (const [i, f] of frames.entries()) {
    const name = frameLabel(i, f.clientName);
    const truncated = await truncationReason(f.tempPath, f.format);
    if (truncated) throw new BadRequestError(`${name}: ${truncated}`);
    const probe = await probeImage(f.tempPath, cap).catch((e: unknown) => {
      throw e instanceof AppError ? new BadRequestError(`${name}: ${e.message}`) : e;
    });
    if (probe.width < MIN_FRAME_SIDE || probe.height < MIN_FRAME_SIDE)
      throw new BadRequestError(`${name}: frames must be at least ${MIN_FRAME_SIDE} px on each side.`);
    if (!first) first = probe;
    else if (probe.width !== first.width || probe.height !== first.height) {
      throw new BadRequestError(
        `${name}: it is ${probe.width} × ${probe.height} px, but frame 1 is ${first.width} × ${first.height} px; every frame of a mosaic must be the same size.`,
      );
    } else if (probe.format !== first.format) {
      throw new BadRequestError(`${name}: it is ${probe.format}, but frame 1 is ${first.format}; every frame of a mosaic must be in the same format.`);
    }
  }
  return first!;
}

/**
 * Accepts a received mosaic: the grid (rows × cols, capture order, nominal overlap) and the
 * capture data are checked, then every frame as an upload is, then the frames are stored under
 * the micrograph's mosaic prefix and the micrograph, its mosaic record and the stitch job are
 * written in one transaction. Any refusal names the frame and leaves nothing: no row, no object,
 * no temporary file.
 */
export async function ingestMosaic(db: Database, actor: Actor, dieId: string, frames: ReceivedFrame[], fields: Record<string, string>): Promise<MicrographDto> {
  const id = crypto.randomUUID();
  const stored: string[] = [];
  try {
    const { grid: gridFields, capture: captureFields } = splitFields(fields);
    const g = mosaicGridSchema.safeParse(gridFields);
    if (!g.success) throw zodFailure(g.error, "mosaic");
    const c = captureSchema.safeParse(captureFields);
    if (!c.success) throw zodFailure(c.error, "capture data");
    const grid = g.data;
    const capture = c.data;
    const expected = grid.rows * grid.cols;
    if (frames.length !== expected) {
      throw new BadRequestError(`A ${grid.rows} × ${grid.cols} mosaic needs ${expected} frames in parts named “file”; ${frames.length} arrived.`);
    }
    const frame = await checkFrames(frames);
    const step = (n: number, side: number) => Math.round(side + (n - 1) * side * (1 - grid.overlapPercent / 100));
    const width = step(grid.cols, frame.width);
    const height = step(grid.rows, frame.height);
    if (width * height > env().KERFLINE_MAX_PIXELS) {
      throw new BadRequestError(`The stitched mosaic would be about ${width} × ${height} px, more than the limit of ${env().KERFLINE_MAX_PIXELS} px.`);
    }
    const scale =
      capture.scaleUmPerPx ??
      (capture.cameraPixelPitchUm && capture.objectiveMag
        ? scaleFromCapture({ cameraPixelPitchUm: capture.cameraPixelPitchUm, objectiveMag: capture.objectiveMag, adapterMag: capture.adapterMag })
        : null);
    for (const [i, f] of frames.entries()) {
      const key = mosaicFrameKey(dieId, id, i, frame.format);
      await objectStore().putFile(key, f.tempPath);
      stored.push(key);
    }
    await db.transaction(async (tx) => {
      // Size and format are the nominal estimate until the stitch records the composed image.
      const row = {
        id,
        label: capture.label || `Mosaic ${grid.rows} × ${grid.cols}`,
        illumination: capture.illumination,
        objectiveMag: capture.objectiveMag,
        numericalAperture: capture.numericalAperture,
        cameraPixelPitchUm: capture.cameraPixelPitchUm,
        adapterMag: capture.adapterMag,
        scaleUmPerPx: scale,
        width,
        height,
        format: "tiff",
        bytes: frames.reduce((n, f) => n + f.bytes, 0),
        storedName: id,
        originalName: `${expected} frames: ${frames[0].clientName} … ${frames.at(-1)!.clientName}`.slice(0, 400),
      };
      await insertMicrograph(tx, actor, dieId, row, "stitch");
      await insertMosaic(tx, {
        micrographId: id,
        rows: grid.rows,
        cols: grid.cols,
        order: grid.order,
        overlapPercent: grid.overlapPercent,
        flatField: grid.flatField ?? capture.illumination === "bright_field",
        frameWidth: frame.width,
        frameHeight: frame.height,
        frameFormat: frame.format,
      });
    });
  } catch (e) {
    await dropFrames(frames);
    await Promise.all(
      stored.map((k) =>
        objectStore()
          .remove(k)
          .catch(() => {}),
      ),
    );
    throw e;
  }
  await dropFrames(frames);
  notifyJobs();
  return getMicrograph(db, actor, id);
}
