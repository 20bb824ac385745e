import { apiRoute } from "@/server/http/route";
import { listCases } from "@/server/access/cases";

export const GET = apiRoute({}, ({ db, actor }) => listCases(db, actor));
