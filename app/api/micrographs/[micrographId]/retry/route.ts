import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { retryTiling } from "@/server/access/micrographs";
import { notifyJobs } from "@/server/jobs/queue";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ micrographId: uuidSchema });

/** Tiles a failed micrograph again (409 unless it failed); answers the queued micrograph. */
export const POST = apiRoute({ params }, async ({ db, actor, params }) => {
  const m = await retryTiling(db, actor, params.micrographId);
  notifyJobs();
  return m;
});
