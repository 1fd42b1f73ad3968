import type { Metadata } from "next";
import { SignInForm } from "../_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: PageProps<"/sign-in">) {
  const { callbackUrl, reset } = await searchParams;
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Sign in</h1>
      {reset === "done" ? (
        <p role="status" className="text-sm text-verdigris-deep">
          Your password is changed. Sign in with the new one.
        </p>
      ) : null}
      <SignInForm callbackUrl={typeof callbackUrl === "string" ? callbackUrl : "/"} />
    </section>
  );
}
