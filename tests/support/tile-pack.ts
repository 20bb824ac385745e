import fs from "node:fs";
import { decodeFooter, FOOTER_BYTES, parseIndex, type PackIndex } from "@/lib/tiles/tile-pack";

/** The index of a tile pack on disk (a local-store object), read as the format describes it. */
export function readPackIndexFile(file: string): PackIndex {
  const bytes = fs.readFileSync(file);
  const { indexOffset, indexLength } = decodeFooter(bytes.subarray(bytes.length - FOOTER_BYTES), bytes.length);
  return parseIndex(bytes.subarray(indexOffset, indexOffset + indexLength), indexOffset);
}
