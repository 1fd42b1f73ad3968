import type { Metadata } from "next";
import { Avatar } from "@/components/avatar";
import { getNotificationSettings } from "@/db/queries/notifications";
import { topicsForRole } from "@/lib/notification-topics";
import { requirePagePermission } from "@/lib/session";
import { AvatarForm } from "./_components/avatar-form";
import { DeleteAccountForm } from "./_components/delete-account-form";
import { NotificationSettingsForm } from "./_components/notification-settings-form";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const user = await requirePagePermission("account:manage", "/account");
  const settings = await getNotificationSettings({ userId: user.id });
  return (
    <section className="max-w-2xl space-y-10">
      <div className="space-y-6">
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
      </div>

      <section id="notifications" aria-labelledby="notifications-heading" className="scroll-mt-4 space-y-3 border-t border-rule pt-6">
        <h2 id="notifications-heading" className="font-serif text-2xl">
          E-mail settings
        </h2>
        <p className="text-sm text-ink-soft">
          Each of these e-mails ends with a link that switches its kind off. Mail about the account itself, such as password resets,
          is always sent.
        </p>
        <NotificationSettingsForm topics={topicsForRole(user.role)} settings={settings} />
      </section>

      <section aria-labelledby="delete-heading" className="space-y-3 border-t border-rule pt-6">
        <h2 id="delete-heading" className="font-serif text-2xl">
          Delete your account
        </h2>
        <p className="text-sm text-ink-soft">
          This cannot be undone. Your name, address, picture, e-mail settings and votes are removed and you are signed out. Comments
          you wrote stay beside the reports they discuss, signed “a former reader”; measurement requests you asked for stay for
          others to vote on.
        </p>
        <DeleteAccountForm email={user.email} />
      </section>
    </section>
  );
}
