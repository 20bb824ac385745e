import "server-only";
import canonicalize from "canonicalize";
import { markupToFeatureCollection } from "@/lib/export/geojson";
import { roundGeometryUm } from "@/lib/units/round-geometry";
import { roundUm } from "@/lib/units/format-um";
import type { AnyShape } from "@/lib/markup/types";
import type { RevisionStamp } from "@/lib/dto/revisions";
import { referenceScale } from "./die-scale";
import type { Db } from "./context";

/** A "scale" of 0.0001 µm/px: the 4 decimals format-um.ts allows at most. */
const FINEST_UM_PER_PX = 1e-4;

/**
 * A die's shapes as GeoJSON in die-frame µm (RFC 7946, planar), written as RFC 8785 canonical
 * JSON so the same markup always gives the same bytes and a signed-off revision's SHA-256 can
 * be checked by anyone. Coordinates are rounded to the decimals the reference micrograph's
 * scale resolves; without a scale to the formatter's finest (4 decimals), which drops float
 * noise and keeps what was typed. Call after the caller has been authorized for the die.
 */
export async function markupGeojson(
  db: Db,
  die: { readonly id: string; readonly name: string; readonly widthUm: number | null; readonly heightUm: number | null },
  shapes: readonly AnyShape[],
  revision: RevisionStamp,
): Promise<string> {
  const scale = (await referenceScale(db, die.id)) ?? FINEST_UM_PER_PX;
  const rounded = shapes.map((s) => ({ ...s, geometry: roundGeometryUm(s.geometry, scale) }) as AnyShape);
  const size = (v: number | null) => (v === null ? null : roundUm(v, scale));
  const collection = markupToFeatureCollection(rounded, { name: die.name, widthUm: size(die.widthUm), heightUm: size(die.heightUm) }, revision);
  return canonicalize(collection)!;
}
