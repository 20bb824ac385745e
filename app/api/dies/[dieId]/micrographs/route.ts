import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listMicrographs } from "@/server/access/micrographs";
import { loadDie } from "@/server/access/dies";
import { uuidSchema } from "@/lib/validation/common";
import { receiveUpload } from "@/server/files/upload";
import { ingestMicrograph } from "@/server/files/ingest";
import { env } from "@/server/env";
import { incomingDir } from "@/server/storage";

export const runtime = "nodejs";
const params = z.object({ dieId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => listMicrographs(db, actor, params.dieId));

/** Upload: authorize before reading a byte, stream to disk, then ingest. Answers 202. */
export const POST = apiRoute({ params }, async ({ db, actor, params, req }) => {
  await loadDie(db, actor, params.dieId, "edit");
  const { file, fields } = await receiveUpload(req, { maxBytes: env().KERFLINE_MAX_UPLOAD_BYTES, incomingDir: incomingDir() });
  const micrograph = await ingestMicrograph(db, actor, params.dieId, file, fields);
  return Response.json(micrograph, { status: 202 });
});
