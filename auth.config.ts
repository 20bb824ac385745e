import type { NextAuthConfig } from "next-auth";

/**
 * The part of the Auth.js configuration that needs neither providers nor the database, so the
 * proxy can use it. The proxy only redirects signed-out visitors; every page, action and route
 * handler checks again through the data-access layer.
 */
export const authConfig = {
  pages: { signIn: "/sign-in" },
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  trustHost: true,
  providers: [],
  callbacks: {
    authorized({ auth }) {
      return !!auth?.user;
    },
    jwt({ token, user }) {
      if (user?.id) token.sub = user.id;
      return token;
    },
    session({ session, token }) {
      if (token.sub && session.user) session.user.id = token.sub;
      return session;
    },
  },
} satisfies NextAuthConfig;
