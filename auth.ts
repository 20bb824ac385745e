import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { authSecret } from "@/server/env";
import { clientAddress } from "@/server/http/client-address";

/** Sign-in refused because of too many failures; the code carries the minutes to wait. */
class TooManyAttempts extends CredentialsSignin {
  constructor(minutes: number) {
    super();
    this.code = `too_many_attempts:${minutes}`;
  }
}

const credentialsSchema = z.object({ email: z.string().trim().min(1).max(320), password: z.string().min(1).max(200) });

async function db() {
  const { database } = await import("@/server/database");
  return database();
}

// Lazy configuration: the database is opened by the first request, never at build time.
export const { handlers, auth, signIn, signOut } = NextAuth(async () => ({
  ...authConfig,
  secret: authSecret(),
  callbacks: {
    ...authConfig.callbacks,
    // Runs wherever the session is read (pages, actions, route handlers, /api/auth/session):
    // a token whose session version is no longer the account's is dropped, cookie and all.
    async jwt({ token, user }) {
      if (user?.id) return { ...token, sub: user.id, sv: user.sessionVersion ?? 0 };
      if (!token.sub) return null;
      const { sessionVersionOf } = await import("@/server/access/sessions");
      const current = await sessionVersionOf(await db(), token.sub);
      return current !== null && current === (token.sv ?? 0) ? token : null;
    },
  },
  events: {
    // Signing out ends every session of the account (per-user version; see README "Sessions").
    async signOut(message) {
      const token = "token" in message ? message.token : null;
      if (!token?.sub) return;
      const { endSessions } = await import("@/server/access/sessions");
      await endSessions(await db(), token.sub, token.sv ?? 0);
    },
  },
  providers: [
    Credentials({
      credentials: { email: { label: "E-mail" }, password: { label: "Password", type: "password" } },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { authenticate } = await import("@/server/access/users");
        const result = await authenticate(await db(), parsed.data.email, parsed.data.password, clientAddress(request.headers));
        if (result.ok) return result.user;
        if (result.reason === "locked") throw new TooManyAttempts(result.retryInMinutes);
        return null;
      },
    }),
  ],
}));
