import type { Metadata } from "next";
import { loadPage } from "@/server/http/page";
import { listInbox } from "@/server/access/inbox";
import { InboxView } from "@/components/account/inbox-view";

export const metadata: Metadata = { title: "Inbox" };

export default async function InboxPage() {
  const { items } = await loadPage(({ db, actor }) => listInbox(db, actor));
  return <InboxView initial={items} />;
}
