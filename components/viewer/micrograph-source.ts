import type OpenSeadragon from "openseadragon";

/**
 * What the viewer shows: the deep-zoom pyramid once the server has built it, or before that
 * a downscaled preview (about 2048 px wide) that is stretched over the full image size.
 */
export type MicrographSource = { kind: "iiif"; infoUrl: string } | { kind: "image"; url: string; width: number; height: number };

/** A string that changes exactly when a different source must be opened. */
export function sourceKey(source: MicrographSource): string {
  return source.kind === "iiif" ? `iiif:${source.infoUrl}` : `image:${source.url}`;
}

/**
 * The OpenSeadragon tile source for a micrograph source. Tiles and the preview are same-origin
 * requests, so the session cookie goes with them without any credentials option.
 */
export function tileSpecFor(source: MicrographSource): OpenSeadragon.TileSourceSpecifier {
  if (source.kind === "iiif") return { tileSource: source.infoUrl };
  // buildPyramid makes smaller levels in the browser so the zoomed-out preview is not aliased.
  return { tileSource: { type: "image", url: source.url, buildPyramid: true } };
}
