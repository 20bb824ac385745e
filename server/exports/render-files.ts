import "server-only";
import sharp from "sharp";
import type { MicrographRow } from "@/db/schema";
import { micrographPaths, EXTENSION } from "@/server/files/storage-paths";
import { env } from "@/server/env";

/** Where a render finds a micrograph's pixels: the original, the tiler's downscaled copy, and the pixel cap. */
export type RenderFiles = { original(m: MicrographRow): string | null; copy(m: MicrographRow): string | null; pixelCap: number };

/** Size of the downscaled copy, or null while it does not exist (tiling not done yet). */
export async function copySize(file: string | null): Promise<{ width: number; height: number } | null> {
  if (!file) return null;
  const meta = await sharp(file)
    .metadata()
    .catch(() => null);
  return meta?.width && meta.height ? { width: meta.width, height: meta.height } : null;
}

/** The files of the data dir, where uploads and the tiler put them. */
export function storedRenderFiles(): RenderFiles {
  return {
    original: (m) => (m.format ? micrographPaths(m.dieId, m.id, m.format as keyof typeof EXTENSION).original : null),
    copy: (m) => micrographPaths(m.dieId, m.id).preview,
    pixelCap: env().KERFLINE_MAX_PIXELS,
  };
}
