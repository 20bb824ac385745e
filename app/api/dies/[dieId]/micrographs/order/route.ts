import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { reorderMicrographs } from "@/server/access/micrograph-management";
import { uuidSchema } from "@/lib/validation/common";
import { micrographOrderSchema } from "@/lib/validation/alignment";

const params = z.object({ dieId: uuidSchema });

/** Sets the display order of a die's micrographs: body `{ ids }` listing every one once. */
export const PUT = apiRoute({ params, body: micrographOrderSchema }, ({ db, actor, params, body }) => reorderMicrographs(db, actor, params.dieId, body.ids));
