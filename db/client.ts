import "server-only";
import path from "node:path";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import * as schema from "./schema";
import { env } from "@/lib/server/env";
import { lockDataDir } from "./data-dir-lock";

export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

type Opened = { db: Database; close: () => Promise<void>; kind: "pglite" | "postgres" };

const MIGRATIONS = path.join(process.cwd(), "db", "migrations");

/**
 * Opens the database named by the configuration and applies the committed migrations:
 * PostgreSQL through node-postgres when DATABASE_URL is set, else PGlite on disk under the
 * data dir (locked against a second process).
 */
export async function openDatabase(options: { databaseUrl?: string; pgliteDir?: string } = {}): Promise<Opened> {
  const databaseUrl = options.databaseUrl ?? env().DATABASE_URL;
  if (databaseUrl) {
    const { Pool } = await import("pg");
    const { drizzle } = await import("drizzle-orm/node-postgres");
    const { migrate } = await import("drizzle-orm/node-postgres/migrator");
    const pool = new Pool({ connectionString: databaseUrl, max: 10 });
    const db = drizzle(pool, { schema });
    await migrate(db, { migrationsFolder: MIGRATIONS });
    return { db: db as unknown as Database, close: () => pool.end(), kind: "postgres" };
  }
  const dir = options.pgliteDir ?? path.join(env().dataDir, "pgdata");
  const release = lockDataDir(dir);
  try {
    const { PGlite } = await import("@electric-sql/pglite");
    const { drizzle } = await import("drizzle-orm/pglite");
    const { migrate } = await import("drizzle-orm/pglite/migrator");
    const client = await PGlite.create(dir);
    const db = drizzle(client, { schema });
    await migrate(db, { migrationsFolder: MIGRATIONS });
    return {
      db: db as unknown as Database,
      close: async () => {
        await client.close();
        release();
      },
      kind: "pglite",
    };
  } catch (e) {
    release();
    throw e;
  }
}

const globalForDb = globalThis as unknown as { __kerflineDb?: Promise<Opened> };

/** The process's one database, opened lazily and cached on globalThis (hot reload safe). */
export function database(): Promise<Database> {
  globalForDb.__kerflineDb ??= openDatabase();
  return globalForDb.__kerflineDb.then((o) => o.db);
}

/** Which engine the process runs on, for the health endpoint and logs. */
export async function databaseKind(): Promise<"pglite" | "postgres"> {
  globalForDb.__kerflineDb ??= openDatabase();
  return (await globalForDb.__kerflineDb).kind;
}
