import { defineConfig } from "drizzle-kit";

// `drizzle-kit generate` only reads the schema; it never opens the database.
export default defineConfig({
  dialect: "postgresql",
  driver: "pglite",
  schema: "./db/schema/index.ts",
  out: "./db/migrations",
  dbCredentials: { url: "./storage/pgdata" },
});
