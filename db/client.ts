import "server-only";
import path from "node:path";
import type { PgDatabase, PgQueryResultHKT } from "drizzle-orm/pg-core";
import * as schema from "./schema";
import { lockDataDir } from "./data-dir-lock";

export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

export type OpenedDatabase = { db: Database; close: () => Promise<void>; kind: "pglite" | "postgres" };

const MIGRATIONS = path.join(process.cwd(), "db", "migrations");
/** Advisory lock key taken while migrating (any constant; "kerf" in ASCII). */
const MIGRATION_LOCK = 0x6b657266;

/**
 * Opens the database named by the configuration and applies the committed migrations:
 * PostgreSQL through node-postgres when a URL is given, else PGlite on disk in `pgliteDir`
 * (locked against a second process). The server layer passes the configuration.
 */
export async function openDatabase(options: { databaseUrl?: string; pgliteDir: string }): Promise<OpenedDatabase> {
  const databaseUrl = options.databaseUrl;
  if (databaseUrl) {
    const { Pool } = await import("pg");
    const { drizzle } = await import("drizzle-orm/node-postgres");
    const { migrate } = await import("drizzle-orm/node-postgres/migrator");
    const pool = new Pool({ connectionString: databaseUrl, max: 10 });
    const db = drizzle(pool, { schema });
    // Several web servers and workers may start at once on one database: one migrates at a time
    // (a session advisory lock; the others wait, then find nothing left to apply).
    const lock = await pool.connect();
    try {
      await lock.query("select pg_advisory_lock($1)", [MIGRATION_LOCK]);
      await migrate(db, { migrationsFolder: MIGRATIONS });
    } finally {
      await lock.query("select pg_advisory_unlock($1)", [MIGRATION_LOCK]).catch(() => {});
      lock.release();
    }
    return { db: db as unknown as Database, close: () => pool.end(), kind: "postgres" };
  }
  const dir = options.pgliteDir;
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
