import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { proposeDieEdge } from "@/server/die-edge-proposal";
import { uuidSchema } from "@/lib/validation/common";

export const runtime = "nodejs";
const params = z.object({ micrographId: uuidSchema });

/**
 * Proposes a die outline from the micrograph's edge structure, answered at once (it reads a
 * reduced level of the pyramid): `{ cornersPx, cornersUm, confidence }`. Stores nothing.
 */
export const POST = apiRoute({ params }, async ({ db, actor, params }) => proposeDieEdge(db, actor, params.micrographId));
