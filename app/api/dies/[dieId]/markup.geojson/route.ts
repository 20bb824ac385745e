import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { listMarkup } from "@/db/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { attachmentDisposition } from "@/lib/markup/attachment";
import { markupToFeatureCollection } from "@/lib/export/geojson";

const params = z.object({ dieId: uuidSchema });

/** Every shape of the die as a GeoJSON FeatureCollection in die-frame µm (RFC 7946, planar). */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { die, shapes } = await listMarkup(db, actor, params.dieId, "export");
  return new Response(JSON.stringify(markupToFeatureCollection(shapes, die)), {
    headers: {
      "Content-Type": "application/geo+json; charset=utf-8",
      "Content-Disposition": attachmentDisposition(`${die.name} markup.geojson`),
      "Cache-Control": "private, no-store",
    },
  });
});
