import { z } from "zod";
import { apiRoute, noContent } from "@/server/http/route";
import { deleteMarkup, getShape, updateMarkup } from "@/server/access/markup";
import { uuidSchema } from "@/lib/validation/common";
import { markupDeleteQuerySchema, markupPatchSchema } from "@/lib/validation/markup";

const params = z.object({ markupId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => getShape(db, actor, params.markupId));

/** `{ version, geometry?, properties? }`: 409 with `{ error, current }` when the version is stale. */
export const PATCH = apiRoute({ params, body: markupPatchSchema }, ({ db, actor, params, body }) => updateMarkup(db, actor, params.markupId, body));

/** 204; with `?version=` only when that is still the stored version (else 409 with the current shape). */
export const DELETE = apiRoute({ params, query: markupDeleteQuerySchema }, async ({ db, actor, params, query }) => {
  await deleteMarkup(db, actor, params.markupId, query.version);
  return noContent();
});
