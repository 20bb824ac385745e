import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { setReference } from "@/server/access/micrograph-management";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ micrographId: uuidSchema });

/** Makes this (aligned) micrograph the die's reference; no transform or markup moves. */
export const PUT = apiRoute({ params }, ({ db, actor, params }) => setReference(db, actor, params.micrographId));
