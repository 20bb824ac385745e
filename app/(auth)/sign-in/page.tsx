import type { Metadata } from "next";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

const ENDED = {
  everywhere: "You were signed out on every device.",
  password: "Your password was changed and every session ended: sign in with the new one.",
} as const;

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; ended?: string }> }) {
  const { callbackUrl, ended } = await searchParams;
  const notice = ended === "everywhere" || ended === "password" ? ENDED[ended] : null;
  let next = "/cases";
  try {
    // The proxy passes an absolute URL; keep only its path so sign-in never redirects off-site.
    if (callbackUrl) next = new URL(callbackUrl, "http://x").pathname;
  } catch {
    /* keep the default */
  }
  return (
    <>
      {notice && (
        <p role="status" className="mb-4 rounded-md border border-ink-700 bg-ink-900 px-3 py-2 text-sm text-ink-200">
          {notice}
        </p>
      )}
      <SignInForm next={next} />
    </>
  );
}
