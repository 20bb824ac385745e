import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { loadReport } from "@/db/access/report";
import { buildReportPdf } from "@/lib/export/report-pdf";
import { safeFileName, attachmentDisposition } from "@/lib/markup/attachment";
import { micrographPaths, EXTENSION } from "@/lib/server/storage-paths";
import { env } from "@/lib/server/env";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ dieId: uuidSchema });

/** The die report as a PDF download (any member), built on request. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const data = await loadReport(db, actor, params.dieId, {
    original: (m) => (m.format ? micrographPaths(m.dieId, m.id, m.format as keyof typeof EXTENSION).original : null),
    copy: (m) => micrographPaths(m.dieId, m.id).preview,
    pixelCap: env().KERFLINE_MAX_PIXELS,
  });
  const pdf = await buildReportPdf(data);
  const name = `${safeFileName(data.caseInfo.title)}-${safeFileName(data.die.name)}-report-${data.generatedAt.slice(0, 10)}.pdf`;
  return new Response(Buffer.from(pdf), {
    headers: { "Content-Type": "application/pdf", "Content-Disposition": attachmentDisposition(name), "Cache-Control": "private, no-store" },
  });
});
