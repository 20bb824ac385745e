/** Shared shapes of the template search (pure; no framework). */

/** A greyscale raster: row-major luminance 0..255. */
export type Gray = { width: number; height: number; data: Float32Array };

/** A box in full-resolution image px of the micrograph (origin top-left, y down). */
export type PxBox = { x: number; y: number; w: number; h: number };

/** Clockwise quarter turns of the template as seen on screen (image y down). */
export type Rotation = 0 | 90 | 180 | 270;

/** One match: its box and sub-pixel centre in image px, its ZNCC score and the variant that matched. */
export type MatchCandidate = { box: PxBox; centre: [number, number]; score: number; rotation: Rotation; mirrored: boolean };

/**
 * Pixels of a micrograph read a region at a time, so a search never holds the whole image at
 * full resolution. `read(box, scale)` gives the box (inside the image) at `scale` ≤ 1: a raster
 * of max(1, round(w·scale)) × max(1, round(h·scale)) px, each the mean of the area it covers.
 */
export type PixelSource = { width: number; height: number; read(box: PxBox, scale: number): Promise<Gray> };
