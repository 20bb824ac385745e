import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { authSecret } from "@/lib/server/env";

/** Sign-in refused because of too many failures; the code carries the minutes to wait. */
class TooManyAttempts extends CredentialsSignin {
  constructor(minutes: number) {
    super();
    this.code = `too_many_attempts:${minutes}`;
  }
}

const credentialsSchema = z.object({ email: z.string().trim().min(1).max(320), password: z.string().min(1).max(200) });

// Lazy configuration: the database is opened by the first request, never at build time.
export const { handlers, auth, signIn, signOut } = NextAuth(async () => ({
  ...authConfig,
  secret: authSecret(),
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
      async authorize(raw) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { database } = await import("@/db/client");
        const { authenticate } = await import("@/db/access/users");
        const db = await database();
        const result = await authenticate(db, parsed.data.email, parsed.data.password);
        if (result.ok) {
          // An existing user invited to another team joins it on signing in.
          const { acceptInvitationsOnSignIn } = await import("@/db/access/invitations");
          await acceptInvitationsOnSignIn(db, result.user);
          return result.user;
        }
        if (result.reason === "locked") throw new TooManyAttempts(result.retryInMinutes);
        return null;
      },
    }),
  ],
}));
