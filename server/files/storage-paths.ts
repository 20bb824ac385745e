import "server-only";
import path from "node:path";
import { env } from "../env";

/**
 * Where a micrograph's files live under the data dir. Everything a die owns sits below one
 * folder per area (originals/<dieId>/, tiles/<dieId>/), so deleting a die removes it whole.
 * Names are built only from server-made UUIDs and fixed extensions, never from client input.
 */
const root = () => env().dataDir;
const checkId = (id: string) => {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) throw new Error(`not a UUID: ${id}`);
  return id;
};

export const EXTENSION = { jpeg: "jpg", png: "png", tiff: "tif", bigtiff: "tif", webp: "webp" } as const;

export const micrographPaths = (dieId: string, micrographId: string, format?: keyof typeof EXTENSION) => {
  const die = checkId(dieId);
  const id = checkId(micrographId);
  const tiles = path.join(/*turbopackIgnore: true*/ root(), "tiles", die);
  return {
    original: format ? path.join(/*turbopackIgnore: true*/ root(), "originals", die, `${id}.${EXTENSION[format]}`) : null,
    originalsDir: path.join(/*turbopackIgnore: true*/ root(), "originals", die),
    tilesDir: tiles,
    pyramid: path.join(tiles, id),
    preview: path.join(tiles, `${id}-preview.jpg`),
    thumbnail: path.join(tiles, `${id}-thumb.jpg`),
  };
};

/** Uploads stream here first and are moved into originals/ only once accepted. */
export const incomingDir = () => path.join(/*turbopackIgnore: true*/ root(), "originals", ".incoming");
