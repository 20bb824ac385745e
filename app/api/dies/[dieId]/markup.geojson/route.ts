import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listMarkup } from "@/server/access/markup";
import { markupGeojson } from "@/server/access/markup-geojson";
import { revisionStamp } from "@/server/access/revisions";
import { uuidSchema } from "@/lib/validation/common";
import { attachmentDisposition } from "@/lib/markup/attachment";

const params = z.object({ dieId: uuidSchema });

/**
 * Every shape of the die as a GeoJSON FeatureCollection in die-frame µm (RFC 7946, planar),
 * canonical JSON, with the revision it belongs to and its sign-off in the `kerfline` member.
 */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { die, shapes } = await listMarkup(db, actor, params.dieId, "export");
  const json = await markupGeojson(db, die, shapes, await revisionStamp(db, die));
  return new Response(json, {
    headers: {
      "Content-Type": "application/geo+json; charset=utf-8",
      "Content-Disposition": attachmentDisposition(`${die.name} markup.geojson`),
      "Cache-Control": "private, no-store",
    },
  });
});
