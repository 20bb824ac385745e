import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { getImageSearch } from "@/server/access/image-searches";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ micrographId: uuidSchema, jobId: uuidSchema });

/** A search's status and progress; once done, `candidates` (best first), `searchedPx` and `elapsedMs` beside them. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const dto = await getImageSearch(db, actor, params.micrographId, params.jobId);
  return Response.json(dto, { headers: { "Cache-Control": "private, no-store" } });
});
