import type { DefaultSession } from "next-auth";

declare module "next-auth" {
  interface Session {
    user: { id: string } & DefaultSession["user"];
  }
  interface User {
    /** The account's session version when this sign-in happened (see server/access/sessions.ts). */
    sessionVersion?: number;
  }
}

declare module "@auth/core/jwt" {
  interface JWT {
    /** Session version the token was issued under; refused once the account's has moved on. */
    sv?: number;
  }
}
