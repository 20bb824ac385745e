import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { createExport, listExports } from "@/server/access/exports";
import { notifyJobs } from "@/server/jobs/queue";
import { uuidSchema } from "@/lib/validation/common";
import { exportRequestSchema } from "@/lib/validation/exports";
import { env } from "@/server/env";

const params = z.object({ dieId: uuidSchema });

/** Queues an annotated PNG export (any member); 202 with the export to poll, 429 over the quota. */
export const POST = apiRoute({ params, body: exportRequestSchema }, async ({ db, actor, params, body }) => {
  const quota = { perUser: env().KERFLINE_EXPORTS_PENDING_PER_USER, perDie: env().KERFLINE_EXPORTS_PENDING_PER_DIE };
  const created = await createExport(db, actor, params.dieId, body, quota);
  notifyJobs();
  return Response.json(created, { status: 202, headers: { Location: `/api/exports/${created.id}` } });
});

/** The die's recent exports, newest first. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => listExports(db, actor, params.dieId));
