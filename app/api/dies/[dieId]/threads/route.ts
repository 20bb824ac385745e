import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { createThread, listThreads } from "@/server/access/threads";
import { publicOrigin } from "@/server/http/origin";
import { uuidSchema } from "@/lib/validation/common";
import { newThreadSchema } from "@/lib/validation/review";

const params = z.object({ dieId: uuidSchema });

/** The die's threads with their comments; `orphaned` marks threads whose shape was deleted. */
export const GET = apiRoute({ params }, ({ db, actor, params }) => listThreads(db, actor, params.dieId));

/** `{ shapeId, body }` or `{ region: Polygon in die µm, body }`: 201 with the new thread. */
export const POST = apiRoute({ params, body: newThreadSchema }, async ({ db, actor, params, body, req }) =>
  created(await createThread(db, actor, params.dieId, body, publicOrigin(req))),
);
