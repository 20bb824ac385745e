import type { Metadata } from "next";
import { loadPage } from "@/server/http/page";
import { getNotificationPrefs } from "@/server/access/notification-prefs";
import { NotificationSettings } from "@/components/review/notification-settings";

export const metadata: Metadata = { title: "Notifications" };

export default async function NotificationsPage() {
  const prefs = await loadPage(({ db, actor }) => getNotificationPrefs(db, actor));
  return <NotificationSettings initial={prefs} />;
}
