// A fresh database of its own on the PostgreSQL test server (KERFLINE_TEST_DATABASE_URL, set by
// scripts/with-postgres.mjs), for tests that start their own processes on one shared database.
import pg from "pg";

export async function freshPostgresDatabase(prefix: string): Promise<string> {
  const base = process.env.KERFLINE_TEST_DATABASE_URL;
  if (!base) throw new Error("KERFLINE_TEST_DATABASE_URL is not set (run under scripts/with-postgres.mjs)");
  const name = `${prefix}_${Date.now().toString(36)}_${Math.floor(Math.random() * 1e6)}`;
  const client = new pg.Client({ connectionString: base });
  await client.connect();
  try {
    await client.query(`create database ${name}`);
  } finally {
    await client.end();
  }
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}
