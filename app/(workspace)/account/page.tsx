import type { Metadata } from "next";
import { loadPage } from "@/server/http/page";
import { getMe } from "@/server/access/teams";
import { AccountView } from "@/components/account/account-view";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const me = await loadPage(({ db, actor }) => getMe(db, actor));
  return <AccountView me={me} />;
}
