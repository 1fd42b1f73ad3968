import type { Metadata } from "next";
import { SignUpForm } from "../_components/sign-up-form";

export const metadata: Metadata = { title: "Join as a reader" };

export default function SignUpPage() {
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Join as a reader</h1>
      <p className="text-sm text-ink-soft">Readers comment on reports, ask for measurements and vote on other readers&apos; requests.</p>
      <SignUpForm />
    </section>
  );
}
