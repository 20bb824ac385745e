import type { Geometry } from "@/lib/geometry/types";
import { MARKUP_SCHEMA_VERSION, type AnyShape, type MarkupKind } from "@/lib/markup/types";
import type { RevisionStamp } from "@/lib/dto/revisions";

/**
 * Markup as a GeoJSON FeatureCollection (RFC 7946). Coordinates are planar die-frame µm, not
 * WGS84 longitude/latitude, so the collection carries a foreign member (RFC 7946 §6.1) saying
 * so; readers that ignore it still get valid GeoJSON structure.
 */

const GEOJSON_FRAME = "die, origin lower-left, y up";

/** What the top-level `kerfline` member states about the coordinates. */
type GeoJsonFrameInfo = {
  readonly units: "µm";
  readonly frame: typeof GEOJSON_FRAME;
  readonly schemaVersion: number;
  readonly die?: { readonly name: string; readonly widthUm: number | null; readonly heightUm: number | null };
  /** Which revision of the markup this is, and whether (by whom, when) it is signed off. */
  readonly revision?: RevisionStamp;
};

export type MarkupFeature = {
  readonly type: "Feature";
  readonly id: string;
  readonly geometry: Geometry;
  readonly properties: { readonly kind: MarkupKind } & Record<string, unknown>;
};

export type MarkupFeatureCollection = {
  readonly type: "FeatureCollection";
  readonly kerfline: GeoJsonFrameInfo;
  readonly features: readonly MarkupFeature[];
};

/** One shape as a Feature: its kind travels inside properties, beside the shape's own. */
export function shapeToFeature(shape: AnyShape): MarkupFeature {
  return { type: "Feature", id: shape.id, geometry: shape.geometry, properties: { kind: shape.kind, ...shape.properties } };
}

/**
 * Every shape of a die as one FeatureCollection, in the order given.
 * @param die the die's name and size, written into the `kerfline` member for the reader
 * @param revision the revision the shapes belong to, written there too
 */
export function markupToFeatureCollection(
  shapes: readonly AnyShape[],
  die?: { readonly name: string; readonly widthUm: number | null; readonly heightUm: number | null },
  revision?: RevisionStamp,
): MarkupFeatureCollection {
  return {
    type: "FeatureCollection",
    kerfline: {
      units: "µm",
      frame: GEOJSON_FRAME,
      schemaVersion: MARKUP_SCHEMA_VERSION,
      ...(die ? { die: { name: die.name, widthUm: die.widthUm, heightUm: die.heightUm } } : {}),
      ...(revision ? { revision } : {}),
    },
    features: shapes.map(shapeToFeature),
  };
}
