import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { listReviewEvents, reviewDie } from "@/server/access/review";
import { publicOrigin } from "@/server/http/origin";
import { uuidSchema } from "@/lib/validation/common";
import { reviewActionSchema } from "@/lib/validation/review";

const params = z.object({ dieId: uuidSchema });

/** The die's review history, newest first. */
export const GET = apiRoute({ params }, ({ db, actor, params }) => listReviewEvents(db, actor, params.dieId));

/** `{ action: submit|approve|request_changes, message }`: answers with the die; 403 for the die's own analyst deciding, 409 for a move the status does not allow. */
export const POST = apiRoute({ params, body: reviewActionSchema }, ({ db, actor, params, body, req }) =>
  reviewDie(db, actor, params.dieId, body, publicOrigin(req)),
);
