import { databaseKind } from "@/server/database";

export const dynamic = "force-dynamic";

/** Liveness for tests and load balancers: answers once the database is open. */
export async function GET() {
  return Response.json({ ok: true, database: await databaseKind() });
}
