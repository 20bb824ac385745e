import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { previewExport } from "@/server/exports/preview";
import { storedRenderFiles } from "@/server/exports/render-files";
import { uuidSchema } from "@/lib/validation/common";
import { exportRequestSchema } from "@/lib/validation/exports";

const params = z.object({ dieId: uuidSchema });

/** A small rendering of what an export request would produce (any member); nothing is stored. */
export const POST = apiRoute({ params, body: exportRequestSchema }, async ({ db, actor, params, body }) =>
  previewExport(db, actor, params.dieId, body, storedRenderFiles()),
);
