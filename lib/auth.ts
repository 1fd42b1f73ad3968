import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { getUserCredentials } from "@/db/queries/users";
import { authConfig } from "@/lib/auth.config";
import { verifyPassword } from "@/lib/passwords";
import { clientAddressOf, isSignInThrottled, recordSignInAttempt } from "@/lib/sign-in-throttle";
import { signInSchema } from "@/lib/validations/account";

class ThrottledSignIn extends CredentialsSignin {
  code = "throttled";
}

export const { auth, handlers, signIn, signOut } = NextAuth({
  ...authConfig,
  providers: [
    Credentials({
      credentials: { email: { label: "Email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, request) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const clientAddress = clientAddressOf(request.headers);
        if (await isSignInThrottled({ email, clientAddress })) throw new ThrottledSignIn();

        const user = await getUserCredentials({ email });
        const succeeded = user ? await verifyPassword(user.passwordHash, password) : false;
        await recordSignInAttempt({ email, clientAddress, succeeded });
        if (!user || !succeeded) return null;
        return { id: user.id, email: user.email, name: user.name, role: user.role };
      },
    }),
  ],
});
