import NextAuth from "next-auth";
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { authConfig } from "./auth.config";
import { sameOriginVerdict } from "@/server/http/origin";
import { env } from "@/server/env";
import { COMMON_SECURITY_HEADERS, newNonce, pageContentSecurityPolicy } from "@/lib/http/security-headers";

// Pages only. The API is not matched: uploads through the proxy are buffered and cut at
// 10 MB; every handler authorizes itself and apiRoute checks the origin of writes.
// Here: server actions from another origin answer 403, every page gets its security headers
// and a per-request script nonce, and signed-out visitors are sent to the sign-in page.
const { auth } = NextAuth(authConfig);
const PUBLIC_PAGES = /^\/(sign-in|invitations)(\/|$)/;

function withSecurityHeaders(res: Response, csp: string): Response {
  for (const [name, value] of Object.entries(COMMON_SECURITY_HEADERS)) res.headers.set(name, value);
  res.headers.set("Content-Security-Policy", csp);
  // A redirect or page that renews the session cookie must never be stored by a shared cache.
  if (res.headers.has("set-cookie") || res.status >= 300) res.headers.set("Cache-Control", "private, no-store");
  return res;
}

const policyFor = (nonce: string) => pageContentSecurityPolicy(nonce, env().NODE_ENV === "development");

const withSession = auth((req) => {
  const nonce = newNonce();
  const csp = policyFor(nonce);
  const { pathname } = req.nextUrl;
  if (!req.auth?.user && !PUBLIC_PAGES.test(pathname)) {
    const signIn = new URL("/sign-in", req.nextUrl);
    signIn.searchParams.set("callbackUrl", req.nextUrl.href);
    return withSecurityHeaders(NextResponse.redirect(signIn), csp);
  }
  // Next.js reads the nonce from the request's policy and puts it on the scripts it writes.
  const headers = new Headers(req.headers);
  headers.set("content-security-policy", csp);
  headers.set("x-nonce", nonce);
  return withSecurityHeaders(NextResponse.next({ request: { headers } }), csp);
});

/** Refusals and the bare `/` redirect are answered before the session is read, so they carry no cookie. */
export default function proxy(req: NextRequest, ev: NextFetchEvent) {
  const verdict = sameOriginVerdict(req);
  if (!verdict.ok) return withSecurityHeaders(Response.json({ error: verdict.reason }, { status: 403 }), policyFor(newNonce()));
  if (req.nextUrl.pathname === "/") return withSecurityHeaders(NextResponse.redirect(new URL("/cases", req.nextUrl)), policyFor(newNonce()));
  return (withSession as unknown as (r: NextRequest, e: NextFetchEvent) => Promise<Response>)(req, ev);
}

export const config = {
  matcher: ["/((?!api|_next/static|_next/image|favicon.ico|icon.svg).*)"],
};
