import type { Metadata } from "next";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  let next = "/cases";
  try {
    // The proxy passes an absolute URL; keep only its path so sign-in never redirects off-site.
    if (callbackUrl) next = new URL(callbackUrl, "http://x").pathname;
  } catch {
    /* keep the default */
  }
  return <SignInForm next={next} />;
}
