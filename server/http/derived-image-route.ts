import "server-only";
import { z } from "zod";
import { apiRoute } from "./route";
import { loadMicrograph } from "@/server/access/micrographs";
import { uuidSchema } from "@/lib/validation/common";
import { micrographKeys } from "../storage/keys";
import { AppError } from "@/lib/errors";
import { serveImmutable, storedBody } from "./serve-file";

/**
 * GET handler for a micrograph's preview (made first, so the die opens before the pyramid is
 * done) or thumbnail (made last), for members of its team.
 */
export function derivedImageRoute(kind: "preview" | "thumbnail") {
  return apiRoute({ params: z.object({ micrographId: uuidSchema }) }, async ({ db, actor, params, req }) => {
    const { row } = await loadMicrograph(db, actor, params.micrographId, "read");
    const made = kind === "preview" ? !!row.previewWidth : row.status === "ready";
    if (!made) throw new AppError(409, "Not made yet: the micrograph is still being processed.");
    const k = micrographKeys(row.dieId, row.id);
    return serveImmutable(req, await storedBody(kind === "preview" ? k.preview : k.thumbnail), `${row.id}-${kind}`, "image/jpeg");
  });
}
