import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { restoreDieFrame } from "@/server/access/die-frame";
import { uuidSchema } from "@/lib/validation/common";
import { frameRestoreSchema } from "@/lib/validation/markup";

const params = z.object({ dieId: uuidSchema });

/**
 * Undoes a re-framing by a die outline: `{ originUm, widthUm, heightUm, outline }` names the
 * earlier frame (its origin in the current frame, its size, its outline or null). Everything
 * moves back in one transaction; answers `{ moved }`.
 */
export const POST = apiRoute({ params, body: frameRestoreSchema }, async ({ db, actor, params, body }) => {
  return restoreDieFrame(db, actor, params.dieId, body);
});
