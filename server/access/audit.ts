import "server-only";
import type { Db, Actor } from "./context";
import { auditEvents } from "@/db/schema";

/** Plain JSON of a row for the audit trail (dates as ISO strings). */
export function snapshot(row: object | null | undefined): unknown {
  return row ? JSON.parse(JSON.stringify(row)) : null;
}

/** Writes one audit event in the caller's transaction, so it lands with the change or not at all. */
export async function recordAudit(
  db: Db,
  actor: Actor | null,
  event: { teamId: string | null; action: string; entityType: string; entityId: string | null; dieId?: string | null; before?: unknown; after?: unknown },
): Promise<void> {
  await db.insert(auditEvents).values({
    teamId: event.teamId,
    actorId: actor?.userId ?? null,
    action: event.action,
    entityType: event.entityType,
    entityId: event.entityId,
    dieId: event.dieId ?? null,
    before: snapshot(event.before as object) ?? null,
    after: snapshot(event.after as object) ?? null,
  });
}
