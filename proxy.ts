import NextAuth from "next-auth";
import { NextResponse } from "next/server";
import { authConfig } from "@/lib/auth.config";

const { auth } = NextAuth(authConfig);

// Only an early redirect for anonymous visitors: every page, action and handler checks the role again on the server.
export default auth((request) => {
  if (!request.auth) {
    const signIn = new URL("/sign-in", request.nextUrl.origin);
    signIn.searchParams.set("callbackUrl", request.nextUrl.pathname);
    return NextResponse.redirect(signIn);
  }
  return NextResponse.next();
});

export const config = { matcher: ["/account/:path*", "/workspace/:path*", "/desk/:path*", "/admin/:path*"] };
