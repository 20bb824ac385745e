import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { BadRequestError, ConflictError } from "@/lib/errors";
import { listMarkup } from "@/server/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { padTableQuerySchema } from "@/lib/validation/markup";
import { padTableFromMarkup } from "@/lib/markup/pad-table-from-markup";

const params = z.object({ dieId: uuidSchema });

/**
 * The pad table as JSON for the pad panel: `{ die, rows, summary, outlineSource }`. 400 for a
 * pad 1 that is not a pad; 409 when the die's markup cannot make a table (no outline and no size).
 */
export const GET = apiRoute({ params, query: padTableQuerySchema }, async ({ db, actor, params, query }) => {
  const { die, shapes } = await listMarkup(db, actor, params.dieId, "read");
  const r = padTableFromMarkup(shapes, die, { padOneId: query.padOne });
  if (!r.ok) throw r.reason === "bad_request" ? new BadRequestError(r.message) : new ConflictError(r.message);
  return { ...r.table, outlineSource: r.outlineSource };
});
