import { z } from "zod";
import { apiRoute } from "@/lib/server/route";
import { setReference } from "@/db/access/micrograph-management";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ micrographId: uuidSchema });

/** Makes this (aligned) micrograph the die's reference; no transform or markup moves. */
export const PUT = apiRoute({ params }, ({ db, actor, params }) => setReference(db, actor, params.micrographId));
