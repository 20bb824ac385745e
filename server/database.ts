import "server-only";
import path from "node:path";
import { openDatabase, type Database, type OpenedDatabase } from "@/db/client";
import { env } from "./env";

/** Opens the database the configuration names: DATABASE_URL, else PGlite under the data dir. */
export function openConfiguredDatabase(): Promise<OpenedDatabase> {
  return openDatabase({ databaseUrl: env().DATABASE_URL, pgliteDir: path.join(env().dataDir, "pgdata") });
}

const globalForDb = globalThis as unknown as { __kerflineDb?: Promise<OpenedDatabase> };

/** The process's one database, opened once and cached on globalThis (hot reload safe). */
export function openedDatabase(): Promise<OpenedDatabase> {
  globalForDb.__kerflineDb ??= openConfiguredDatabase();
  return globalForDb.__kerflineDb;
}

/** The process's one database. */
export function database(): Promise<Database> {
  return openedDatabase().then((o) => o.db);
}

/** Which engine the process runs on, for the health endpoint and logs. */
export async function databaseKind(): Promise<"pglite" | "postgres"> {
  return (await openedDatabase()).kind;
}
