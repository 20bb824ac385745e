import { apiRoute } from "@/server/http/route";
import { getMe } from "@/server/access/teams";

export const GET = apiRoute({}, ({ db, actor }) => getMe(db, actor));
