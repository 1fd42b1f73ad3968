import type { NextAuthConfig } from "next-auth";
import type { Role } from "@/lib/authz";

// Kept free of providers and database code so proxy.ts can load it on its own.
export const authConfig = {
  pages: { signIn: "/sign-in" },
  session: { strategy: "jwt", maxAge: 60 * 60 * 24 * 14 },
  providers: [],
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) {
        token.userId = user.id;
        token.role = user.role;
      }
      return token;
    },
    session({ session, token }) {
      if (typeof token.userId === "string") session.user.id = token.userId;
      session.user.role = token.role as Role;
      return session;
    },
  },
} satisfies NextAuthConfig;
