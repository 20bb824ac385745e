import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { uuidSchema } from "@/lib/validation/common";
import { restitchSchema } from "@/lib/validation/mosaics";
import { restitchMosaic } from "@/server/access/mosaic-restitch";
import { getMicrograph } from "@/server/access/micrographs";
import { notifyJobs } from "@/server/jobs/queue";

const params = z.object({ micrographId: uuidSchema });

/** Stitch the stored frames again with another overlap, order or shading choice; the served result stays until the new one is ready. 202. */
export const POST = apiRoute({ params, body: restitchSchema }, async ({ db, actor, params, body }) => {
  await restitchMosaic(db, actor, params.micrographId, body);
  notifyJobs();
  return Response.json(await getMicrograph(db, actor, params.micrographId), { status: 202 });
});
