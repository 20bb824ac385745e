import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

// Redirects signed-out visitors of pages to the sign-in page. The API is not matched: uploads
// through the proxy are buffered and cut at 10 MB, and every handler authorizes itself.
const { auth } = NextAuth(authConfig);
export default auth;

export const config = {
  matcher: ["/((?!api|_next/static|_next/image|favicon.ico|sign-in|invitations|icon.svg).*)"],
};
