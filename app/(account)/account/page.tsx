import type { Metadata } from "next";
import { Avatar } from "@/components/avatar";
import { requirePagePermission } from "@/lib/session";
import { AvatarForm } from "./_components/avatar-form";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const user = await requirePagePermission("account:manage", "/account");
  return (
    <section className="max-w-2xl space-y-6">
      <h1 className="font-serif text-3xl">Your account</h1>
      <div className="flex items-center gap-4">
        <Avatar userId={user.id} avatarKey={user.avatarKey} name={user.name} size={72} />
        <div>
          <p className="text-lg font-semibold">{user.name}</p>
          <p className="text-sm text-ink-soft">
            {user.email} · <span className="font-semibold">{user.role}</span>
          </p>
        </div>
      </div>
      <AvatarForm />
    </section>
  );
}
