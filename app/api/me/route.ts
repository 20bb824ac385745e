import { apiRoute } from "@/lib/server/route";
import { getMe } from "@/db/access/teams";

export const GET = apiRoute({}, ({ db, actor }) => getMe(db, actor));
