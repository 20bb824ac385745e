import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadExport } from "@/server/access/exports";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ exportId: uuidSchema });

/** An export's status, progress, warnings and result. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { dto } = await loadExport(db, actor, params.exportId);
  return Response.json(dto, { headers: { "Cache-Control": "private, no-store" } });
});
