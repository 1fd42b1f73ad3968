import type { Metadata } from "next";
import { NewPasswordForm } from "../../_components/new-password-form";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function NewPasswordPage({ params }: PageProps<"/reset-password/[token]">) {
  const { token } = await params;
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Choose a new password</h1>
      <NewPasswordForm token={token} />
    </section>
  );
}
