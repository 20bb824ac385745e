import { z } from "zod";
import { apiRoute } from "@/server/http/route";
import { getSampleRecord, putSampleRecord } from "@/server/access/sample";
import { sampleRecordSchema } from "@/lib/validation/sample";
import { uuidSchema } from "@/lib/validation/common";

const params = z.object({ caseId: uuidSchema });

export const GET = apiRoute({ params }, ({ db, actor, params }) => getSampleRecord(db, actor, params.caseId));

export const PUT = apiRoute({ params, body: sampleRecordSchema }, ({ db, actor, params, body }) => putSampleRecord(db, actor, params.caseId, body));
