import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { revisionStamp } from "@/server/access/revisions";
import { revisionFileTag } from "@/lib/review/revision-text";
import { BadRequestError, ConflictError } from "@/lib/errors";
import { listMarkup } from "@/server/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { padTableQuerySchema } from "@/lib/validation/markup";
import { padTableFromMarkup } from "@/lib/markup/pad-table-from-markup";
import { attachmentDisposition } from "@/lib/markup/attachment";
import { padTableCsv } from "@/lib/pads";
import { referenceScale } from "@/server/access/die-scale";
import { umDecimals } from "@/lib/units/format-um";

const params = z.object({ dieId: uuidSchema });

/**
 * The pad table as an RFC 4180 CSV download, the same rows as GET …/pads. Cells are written
 * as they are: a label starting with "=" stays text to a CSV parser, but a spreadsheet may read
 * it as a formula (guarding it with a leading apostrophe would change the data the table round-trips).
 */
export const GET = apiRoute({ params, query: padTableQuerySchema }, async ({ db, actor, params, query }) => {
  const { die, shapes } = await listMarkup(db, actor, params.dieId, "export");
  const r = padTableFromMarkup(shapes, die, { padOneId: query.padOne });
  if (!r.ok) throw r.reason === "bad_request" ? new BadRequestError(r.message) : new ConflictError(r.message);
  // µm to the decimals the reference micrograph's scale resolves; without one, the CSV's own 3.
  const scale = await referenceScale(db, params.dieId);
  return new Response(padTableCsv(r.table, scale === null ? {} : { decimals: umDecimals(scale) }), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": attachmentDisposition(`${die.name} ${revisionFileTag(await revisionStamp(db, die))} pad table.csv`),
      "Cache-Control": "private, no-store",
    },
  });
});
