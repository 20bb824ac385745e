import { open } from "node:fs/promises";
import type { RasterFormat } from "@/lib/tiles/magic-bytes";

/**
 * A cheap check that an upload arrived whole, by the end markers the formats define, so a cut
 * transfer is refused at upload instead of failing later in tiling. JPEG ends with the EOI
 * marker FF D9 (ITU-T T.81 §B.2.1); PNG ends with the IEND chunk (PNG spec §11.2.5); a WebP
 * RIFF header states the file size (RIFF length + 8). TIFF has no end marker: damage there is
 * found when tiling, and the micrograph is marked failed with the reason.
 * Returns null when complete, or the reason it is not.
 */
export async function truncationReason(path: string, format: RasterFormat): Promise<string | null> {
  const handle = await open(path, "r");
  try {
    const { size } = await handle.stat();
    const tail = Buffer.alloc(Math.min(64, size));
    await handle.read(tail, 0, tail.length, size - tail.length);
    if (format === "jpeg") {
      // Some cameras append padding after EOI: accept the marker anywhere in the last bytes.
      for (let i = tail.length - 2; i >= 0; i--) if (tail[i] === 0xff && tail[i + 1] === 0xd9) return null;
      return "The JPEG file is incomplete (no end-of-image marker): the upload was probably cut short.";
    }
    if (format === "png") {
      const iend = Buffer.from([0x49, 0x45, 0x4e, 0x44, 0xae, 0x42, 0x60, 0x82]);
      return tail.subarray(tail.length - 8).equals(iend) ? null : "The PNG file is incomplete (no IEND chunk): the upload was probably cut short.";
    }
    if (format === "webp") {
      const head = Buffer.alloc(8);
      await handle.read(head, 0, 8, 0);
      return head.readUInt32LE(4) + 8 <= size ? null : "The WebP file is shorter than its header says: the upload was probably cut short.";
    }
    return null;
  } finally {
    await handle.close();
  }
}
