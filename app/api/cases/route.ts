import { apiRoute } from "@/lib/server/route";
import { listCases } from "@/db/access/cases";

export const GET = apiRoute({}, ({ db, actor }) => listCases(db, actor));
