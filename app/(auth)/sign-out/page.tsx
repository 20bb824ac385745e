import type { Metadata } from "next";
import { signOut } from "@/auth";

export const metadata: Metadata = { title: "Sign out" };

export default function SignOutPage() {
  async function doSignOut() {
    "use server";
    await signOut({ redirectTo: "/sign-in" });
  }
  return (
    <form action={doSignOut} className="flex flex-col gap-4">
      <h1 className="text-lg font-semibold">Sign out</h1>
      <p className="text-sm text-ink-300">This ends your sessions on every device, and you will need your password to come back.</p>
      <button type="submit" className="rounded-md bg-kerf-500 px-3 py-2 text-sm font-semibold text-ink-950 hover:bg-kerf-400">
        Sign out
      </button>
    </form>
  );
}
