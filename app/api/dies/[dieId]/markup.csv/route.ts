import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { revisionStamp } from "@/server/access/revisions";
import { revisionFileTag } from "@/lib/review/revision-text";
import { listMarkup, markupAuthors } from "@/server/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { markupTableCsv, markupTableRows } from "@/lib/markup/markup-table";
import { attachmentDisposition } from "@/lib/markup/attachment";
import { referenceScale } from "@/server/access/die-scale";
import { umDecimals } from "@/lib/units/format-um";

const params = z.object({ dieId: uuidSchema });

/** Every shape of the die as an RFC 4180 CSV download: the markup table's rows. */
export const GET = apiRoute({ params }, async ({ db, actor, params }) => {
  const { die, shapes } = await listMarkup(db, actor, params.dieId, "export");
  const rows = markupTableRows(shapes, await markupAuthors(db, shapes));
  const scale = await referenceScale(db, params.dieId);
  return new Response(markupTableCsv(rows, scale === null ? undefined : umDecimals(scale)), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": attachmentDisposition(`${die.name} ${revisionFileTag(await revisionStamp(db, die))} markup.csv`),
      "Cache-Control": "private, no-store",
    },
  });
});
