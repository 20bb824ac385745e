import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { previewExport } from "@/db/access/export-preview";
import { micrographPaths, EXTENSION } from "@/lib/server/storage-paths";
import { env } from "@/lib/server/env";
import { uuidSchema } from "@/lib/validation/common";
import { exportRequestSchema } from "@/lib/validation/exports";

const params = z.object({ dieId: uuidSchema });

/** A small rendering of what an export request would produce (any member); nothing is stored. */
export const POST = apiRoute({ params, body: exportRequestSchema }, async ({ db, actor, params, body }) =>
  previewExport(db, actor, params.dieId, body, {
    original: (m) => (m.format ? micrographPaths(m.dieId, m.id, m.format as keyof typeof EXTENSION).original : null),
    copy: (m) => micrographPaths(m.dieId, m.id).preview,
    pixelCap: env().KERFLINE_MAX_PIXELS,
  }),
);
