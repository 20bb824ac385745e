import { z } from "zod";
import { apiRoute, created } from "@/server/http/route";
import { appendCustody, listCustody } from "@/server/access/sample";
import { custodyEntrySchema } from "@/lib/validation/sample";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ caseId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => listCustody(db, actor, params.caseId));

export const POST = apiRoute({ params, body: custodyEntrySchema }, async ({ db, actor, params, body }) =>
  created(await appendCustody(db, actor, params.caseId, body)),
);

// The chain of custody is append-only: a correction is a new entry, never an edit.
const appendOnly = () =>
  Response.json(
    { error: "The chain of custody is append-only: entries cannot be changed or deleted. Add a new entry instead." },
    { status: 405, headers: { allow: "GET, POST" } },
  );

export const PATCH = appendOnly;
export const DELETE = appendOnly;
