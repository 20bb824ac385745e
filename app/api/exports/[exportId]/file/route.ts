import fs from "node:fs";
import { Readable } from "node:stream";
import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { loadExport } from "@/server/access/exports";
import { exportFilePath } from "@/server/files/export-paths";
import { attachmentDisposition } from "@/lib/markup/attachment";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ exportId: uuidSchema });

/** The rendered PNG, streamed, named case-die-micrograph-date.png (409 while not done). */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { row } = await loadExport(db, actor, params.exportId);
  if (row.status !== "done")
    throw new ConflictError(row.status === "failed" ? `This export failed: ${row.error ?? "no reason given"}` : "This export is still being rendered.");
  const file = exportFilePath(row.dieId, row.id);
  const size = await fs.promises
    .stat(file)
    .then((s) => s.size)
    .catch(() => null);
  if (size === null) throw new NotFoundError("That export's file");
  return new Response(Readable.toWeb(fs.createReadStream(file)) as ReadableStream, {
    headers: {
      "Content-Type": "image/png",
      "Content-Length": String(size),
      "Content-Disposition": attachmentDisposition(row.fileName ?? "export.png"),
      "Cache-Control": "private, no-store",
      "X-Content-Type-Options": "nosniff",
    },
  });
});
