import "server-only";
import { eq } from "drizzle-orm";
import { notificationPrefs } from "@/db/schema";
import type { Actor, Db } from "./context";
import { NOTIFICATION_KINDS, type NotificationKind } from "@/lib/validation/review";
import type { NotificationPrefs } from "@/lib/dto/notification-prefs";

/** The caller's notification choices (everything on unless turned off). */
export async function getNotificationPrefs(db: Db, actor: Actor): Promise<NotificationPrefs> {
  const rows = await db.select().from(notificationPrefs).where(eq(notificationPrefs.userId, actor.userId));
  const prefs = Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, true])) as NotificationPrefs;
  // Rows of kinds no longer offered are ignored.
  for (const r of rows) if (NOTIFICATION_KINDS.includes(r.kind)) prefs[r.kind] = r.enabled;
  return prefs;
}

/** Changes some of the caller's notification choices. */
export async function setNotificationPrefs(db: Db, actor: Actor, patch: Partial<NotificationPrefs>): Promise<NotificationPrefs> {
  for (const [kind, enabled] of Object.entries(patch) as [NotificationKind, boolean | undefined][]) {
    if (enabled === undefined) continue;
    await db
      .insert(notificationPrefs)
      .values({ userId: actor.userId, kind, enabled })
      .onConflictDoUpdate({ target: [notificationPrefs.userId, notificationPrefs.kind], set: { enabled } });
  }
  return getNotificationPrefs(db, actor);
}
