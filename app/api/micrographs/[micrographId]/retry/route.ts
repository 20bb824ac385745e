import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { retryTiling } from "@/db/access/micrographs";
import { notifyJobs } from "@/lib/server/jobs/queue";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ micrographId: uuidSchema });

/** Tiles a failed micrograph again (409 unless it failed); answers the queued micrograph. */
export const POST = apiRoute({ params }, async ({ db, actor, params }) => {
  const m = await retryTiling(db, actor, params.micrographId);
  notifyJobs();
  return m;
});
