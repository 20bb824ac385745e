// A team on its own in-memory PGlite with the real migrations, for tests that drive the
// data-access layer directly (audit rows have no HTTP reader): the demo team's name, an
// analyst and a viewer, and the demo case.
import path from "node:path";
import { PGlite } from "@electric-sql/pglite";
import { drizzle } from "drizzle-orm/pglite";
import { migrate } from "drizzle-orm/pglite/migrator";
import * as schema from "@/db/schema";
import type { Database } from "@/db/client";

export type MemoryTeam = {
  client: PGlite;
  db: Database;
  ids: { team: string; analyst: string; viewer: string; case: string };
};

export async function memoryTeam(): Promise<MemoryTeam> {
  const client = await PGlite.create("memory://");
  const d = drizzle(client, { schema });
  await migrate(d, { migrationsFolder: path.resolve(import.meta.dirname, "../../db/migrations") });
  const db = d as unknown as Database;
  const [team] = await db.insert(schema.teams).values({ name: "Fjordlight Failure Lab" }).returning();
  const [analyst] = await db.insert(schema.users).values({ email: "analyst@fjordlight.test", name: "Demo Analyst" }).returning();
  const [viewer] = await db.insert(schema.users).values({ email: "viewer@fjordlight.test", name: "Demo Viewer" }).returning();
  await db.insert(schema.memberships).values([
    { teamId: team.id, userId: analyst.id, role: "analyst" },
    { teamId: team.id, userId: viewer.id, role: "viewer" },
  ]);
  const [c] = await db.insert(schema.cases).values({ teamId: team.id, title: "NV-24R receiver teardown" }).returning();
  return { client, db, ids: { team: team.id, analyst: analyst.id, viewer: viewer.id, case: c.id } };
}
