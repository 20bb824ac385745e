import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { revisionGeojson } from "@/server/access/revisions";
import { uuidSchema } from "@/lib/validation/common";
import { attachmentDisposition } from "@/lib/markup/attachment";

const params = z.object({ dieId: uuidSchema, number: z.coerce.number({ error: "must be a revision number" }).int().min(1).max(1_000_000) });

/** A revision's markup as GeoJSON; a signed-off one byte for byte as signed, its SHA-256 (hex) also in X-Content-SHA256. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const r = await revisionGeojson(db, actor, params.dieId, params.number);
  return new Response(r.json, {
    headers: {
      "Content-Type": "application/geo+json; charset=utf-8",
      "Content-Disposition": attachmentDisposition(`${r.dieName} rev ${params.number} markup.geojson`),
      "Cache-Control": "private, no-store",
      "X-Content-SHA256": r.sha256,
    },
  });
});
