import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { loadReport } from "@/server/access/report";
import { buildReportPdf } from "@/lib/export/report-pdf";
import { safeFileName, attachmentDisposition } from "@/lib/markup/attachment";
import { overviewRenderer } from "@/server/exports/report";
import { storedRenderFiles } from "@/server/exports/render-files";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ dieId: uuidSchema });

/** The die report as a PDF download (any member), built on request. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const data = await loadReport(db, actor, params.dieId, overviewRenderer(storedRenderFiles()));
  const pdf = await buildReportPdf(data);
  const name = `${safeFileName(data.caseInfo.title)}-${safeFileName(data.die.name)}-report-${data.generatedAt.slice(0, 10)}.pdf`;
  return new Response(Buffer.from(pdf), {
    headers: { "Content-Type": "application/pdf", "Content-Disposition": attachmentDisposition(name), "Cache-Control": "private, no-store" },
  });
});
