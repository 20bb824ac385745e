import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadDie } from "@/server/access/dies";
import { uuidSchema } from "@/lib/validation/common";
import { receiveFrames } from "@/server/files/mosaic-upload";
import { ingestMosaic } from "@/server/files/mosaic-ingest";
import { env } from "@/server/env";
import { incomingDir } from "@/server/storage";

export const runtime = "nodejs";
const params = z.object({ dieId: uuidSchema });

/** A mosaic upload: authorize before reading a byte, stream every frame to scratch, check, store, queue the stitch. Answers 202. */
export const POST = apiRoute({ params }, async ({ db, actor, params, req }) => {
  await loadDie(db, actor, params.dieId, "edit");
  const { frames, fields } = await receiveFrames(req, { maxBytes: env().KERFLINE_MAX_UPLOAD_BYTES, incomingDir: incomingDir() });
  const m = await ingestMosaic(db, actor, params.dieId, frames, fields);
  return Response.json({ id: m.id, status: m.status }, { status: 202 });
});
