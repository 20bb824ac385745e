import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { listRevisions, openNextRevision } from "@/server/access/revisions";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ dieId: uuidSchema });

/** `[{ number, status, signedOffBy?, signedOffAt?, sha256?, shapeCount }]`, oldest first. */
export const GET = apiRoute({ params }, ({ db, actor, params }) => listRevisions(db, actor, params.dieId));

/** Opens revision N+1 in draft once N is signed off (analyst or owner): 201 with it; 409 before sign-off. */
export const POST = apiRoute({ params }, async ({ db, actor, params }) => created(await openNextRevision(db, actor, params.dieId)));
