import "server-only";
import sharp from "sharp";
import type { MicrographRow } from "@/db/schema";
import { env } from "@/server/env";
import { localCopy, type LocalFile } from "@/server/storage";
import { micrographKeys } from "@/server/storage/keys";

/**
 * Where a render finds a micrograph's pixels: the original, the tiler's downscaled copy (each a
 * local file to release after use, null while missing), and the pixel cap.
 */
export type RenderFiles = { original(m: MicrographRow): Promise<LocalFile | null>; copy(m: MicrographRow): Promise<LocalFile | null>; pixelCap: number };

/** Size of the downscaled copy, or null while it does not exist (tiling not done yet). */
export async function copySize(file: LocalFile | null): Promise<{ width: number; height: number } | null> {
  if (!file) return null;
  const meta = await sharp(file.path)
    .metadata()
    .catch(() => null);
  return meta?.width && meta.height ? { width: meta.width, height: meta.height } : null;
}

/**
 * The micrograph's source for one render: the downscaled copy when `fromCopy`, else the original
 * (fetched only then: on S3 it is a download); `release` frees both.
 */
export async function renderSource(files: RenderFiles, m: MicrographRow, copy: LocalFile | null, fromCopy: boolean) {
  const original = fromCopy
    ? null
    : await files.original(m).catch(async (e: unknown) => {
        await copy?.release();
        throw e;
      });
  return {
    path: fromCopy ? copy!.path : (original?.path ?? null),
    release: async () => {
      await copy?.release();
      await original?.release();
    },
  };
}

/** The micrograph's objects in the store, where uploads and the tiler put them. */
export function storedRenderFiles(): RenderFiles {
  return {
    original: (m) => {
      const key = micrographKeys(m.dieId, m.id, m.format).original;
      return key ? localCopy(key) : Promise.resolve(null);
    },
    copy: (m) => localCopy(micrographKeys(m.dieId, m.id).preview),
    pixelCap: env().KERFLINE_MAX_PIXELS,
  };
}
