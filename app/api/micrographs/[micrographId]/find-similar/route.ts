import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { createImageSearch } from "@/server/access/image-searches";
import { notifyJobs } from "@/server/jobs/queue";
import { uuidSchema } from "@/lib/validation/common";
import { findSimilarSchema } from "@/lib/validation/find-similar";

const params = z.object({ micrographId: uuidSchema });

/**
 * Queues a search for places that look like a pad, a block or a pixel box (owners and
 * analysts). Always 202 with `{ jobId, status, progress, kind }`: poll the Location for the
 * candidates. Refusals (400/404/409) write nothing.
 */
export const POST = apiRoute({ params, body: findSimilarSchema }, async ({ db, actor, params, body }) => {
  const created = await createImageSearch(db, actor, params.micrographId, body);
  notifyJobs();
  return Response.json(created, { status: 202, headers: { Location: `/api/micrographs/${params.micrographId}/find-similar/${created.jobId}` } });
});
