import type { Metadata } from "next";
import { ResetRequestForm } from "../_components/reset-request-form";

export const metadata: Metadata = { title: "Reset your password" };

export default function ResetPasswordPage() {
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Reset your password</h1>
      <p className="text-sm text-ink-soft">We will e-mail a link that works once, for 30 minutes.</p>
      <ResetRequestForm />
    </section>
  );
}
