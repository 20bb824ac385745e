import { Readable } from "node:stream";
import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { loadExport } from "@/server/access/exports";
import { exportKey } from "@/server/storage/keys";
import { objectStore } from "@/server/storage";
import { attachmentDisposition } from "@/lib/markup/attachment";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ exportId: uuidSchema });

/** The rendered PNG, streamed, named case-die-micrograph-date.png (409 while not done). */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { row } = await loadExport(db, actor, params.exportId);
  if (row.status !== "done")
    throw new ConflictError(row.status === "failed" ? `This export failed: ${row.error ?? "no reason given"}` : "This export is still being rendered.");
  const key = exportKey(row.dieId, row.id);
  const stored = await objectStore().stat(key);
  const body = stored && (await objectStore().read(key));
  if (!stored || !body) throw new NotFoundError("That export's file");
  return new Response(Readable.toWeb(body) as ReadableStream, {
    headers: {
      "Content-Type": "image/png",
      "Content-Length": String(stored.size),
      "Content-Disposition": attachmentDisposition(row.fileName ?? "export.png"),
      "Cache-Control": "private, no-store",
      "X-Content-Type-Options": "nosniff",
    },
  });
});
