import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { PGlite } from "@electric-sql/pglite";
import { drizzle } from "drizzle-orm/pglite";
import { migrate } from "drizzle-orm/pglite/migrator";

// The rename of the check states and actions (migration 0005) on rows stored under the old
// names: a database migrated to 0004, given rows in the old words, then migrated to the end.
// Expected values written out from issue #15's mapping (submit → send, approve → sign_off,
// request_changes → return; in_review → with_checker, approved → signed_off,
// changes_requested → returned).
const MIGRATIONS = path.resolve(import.meta.dirname, "../../db/migrations");

function migrationsUpTo(tag: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "kerfline-migrations-"));
  fs.mkdirSync(path.join(dir, "meta"));
  const journal = JSON.parse(fs.readFileSync(path.join(MIGRATIONS, "meta/_journal.json"), "utf8"));
  const upTo = journal.entries.findIndex((e: { tag: string }) => e.tag === tag);
  journal.entries = journal.entries.slice(0, upTo + 1);
  fs.writeFileSync(path.join(dir, "meta/_journal.json"), JSON.stringify(journal));
  for (const e of journal.entries) fs.copyFileSync(path.join(MIGRATIONS, `${e.tag}.sql`), path.join(dir, `${e.tag}.sql`));
  return dir;
}

describe("migration of stored check rows to the new words", () => {
  it("renames statuses, actions and audit codes and keeps everything else", async () => {
    const pg = new PGlite();
    const db = drizzle(pg);
    await migrate(db, { migrationsFolder: migrationsUpTo("0004_sessions-inbox-invitations") });
    await pg.exec(`
      insert into users (id, email, name, password_hash) values ('00000000-0000-4000-8000-000000000001', 'a@fjordlight.test', 'A', 'x');
      insert into teams (id, name) values ('00000000-0000-4000-8000-000000000002', 'T');
      insert into cases (id, team_id, title) values ('00000000-0000-4000-8000-000000000003', '00000000-0000-4000-8000-000000000002', 'C');
      insert into dies (id, case_id, name, review_status) values
        ('00000000-0000-4000-8000-00000000000a', '00000000-0000-4000-8000-000000000003', 'in review', 'in_review'),
        ('00000000-0000-4000-8000-00000000000b', '00000000-0000-4000-8000-000000000003', 'approved', 'approved'),
        ('00000000-0000-4000-8000-00000000000c', '00000000-0000-4000-8000-000000000003', 'changes', 'changes_requested'),
        ('00000000-0000-4000-8000-00000000000d', '00000000-0000-4000-8000-000000000003', 'draft', 'draft');
      insert into review_events (die_id, actor_id, action, from_status, to_status, message) values
        ('00000000-0000-4000-8000-00000000000b', '00000000-0000-4000-8000-000000000001', 'submit', 'draft', 'in_review', 'ready'),
        ('00000000-0000-4000-8000-00000000000b', '00000000-0000-4000-8000-000000000001', 'approve', 'in_review', 'approved', 'ok'),
        ('00000000-0000-4000-8000-00000000000c', '00000000-0000-4000-8000-000000000001', 'request_changes', 'in_review', 'changes_requested', 'VB2');
      insert into audit_events (team_id, actor_id, action, entity_type, entity_id) values
        ('00000000-0000-4000-8000-000000000002', '00000000-0000-4000-8000-000000000001', 'review.approve', 'die', '00000000-0000-4000-8000-00000000000b'),
        ('00000000-0000-4000-8000-000000000002', '00000000-0000-4000-8000-000000000001', 'markup.created', 'markup', '00000000-0000-4000-8000-00000000000b');
    `);
    await migrate(db, { migrationsFolder: MIGRATIONS });
    const dies = (await pg.query<{ name: string; review_status: string; revision: number }>("select name, review_status, revision from dies order by name"))
      .rows;
    expect(dies).toEqual([
      { name: "approved", review_status: "signed_off", revision: 1 },
      { name: "changes", review_status: "returned", revision: 1 },
      { name: "draft", review_status: "draft", revision: 1 },
      { name: "in review", review_status: "with_checker", revision: 1 },
    ]);
    const events = (
      await pg.query<{ action: string; from_status: string; to_status: string; message: string }>(
        "select action, from_status, to_status, message from review_events order by message",
      )
    ).rows;
    expect(events).toEqual([
      { action: "return", from_status: "with_checker", to_status: "returned", message: "VB2" },
      { action: "sign_off", from_status: "with_checker", to_status: "signed_off", message: "ok" },
      { action: "send", from_status: "draft", to_status: "with_checker", message: "ready" },
    ]);
    const audit = (await pg.query<{ action: string }>("select action from audit_events order by action")).rows.map((r) => r.action);
    expect(audit).toEqual(["markup.created", "review.sign_off"]);
    await pg.close();
  });
});
