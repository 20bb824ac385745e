import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listMarkup } from "@/server/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { attachmentDisposition } from "@/lib/markup/attachment";
import { markupToFeatureCollection } from "@/lib/export/geojson";
import { referenceScale } from "@/server/access/die-scale";
import { roundGeometryUm } from "@/lib/units/round-geometry";
import { roundUm } from "@/lib/units/format-um";
import type { AnyShape } from "@/lib/markup/types";

const params = z.object({ dieId: uuidSchema });
/** A "scale" of 0.0001 µm/px: the 4 decimals format-um.ts allows at most. */
const FINEST_UM_PER_PX = 1e-4;

/**
 * Every shape of the die as a GeoJSON FeatureCollection in die-frame µm (RFC 7946, planar),
 * coordinates rounded to the decimals the reference micrograph's scale resolves; without a scale
 * to the formatter's finest (4 decimals), which drops float noise and keeps what was typed.
 */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { die, shapes } = await listMarkup(db, actor, params.dieId, "export");
  const scale = (await referenceScale(db, params.dieId)) ?? FINEST_UM_PER_PX;
  const rounded = shapes.map((s) => ({ ...s, geometry: roundGeometryUm(s.geometry, scale) }) as AnyShape);
  const size = (v: number | null) => (v === null ? null : roundUm(v, scale));
  return new Response(JSON.stringify(markupToFeatureCollection(rounded, { name: die.name, widthUm: size(die.widthUm), heightUm: size(die.heightUm) })), {
    headers: {
      "Content-Type": "application/geo+json; charset=utf-8",
      "Content-Disposition": attachmentDisposition(`${die.name} markup.geojson`),
      "Cache-Control": "private, no-store",
    },
  });
});
