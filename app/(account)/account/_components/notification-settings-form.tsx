"use client";

import { updateNotificationPreferences } from "@/app/(account)/actions";
import { CheckboxField, FormStatus, SubmitButton } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { notificationTopicDetails, type NotificationTopic } from "@/lib/notification-topics";
import { notificationSettingsSchema } from "@/lib/validations/notifications";

export function NotificationSettingsForm({ topics, settings }: { topics: NotificationTopic[]; settings: Record<NotificationTopic, boolean> }) {
  const [state, formAction, pending] = useCheckedAction(updateNotificationPreferences, notificationSettingsSchema);
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold">Send me e-mails about…</legend>
        {topics.map((topic) => (
          <CheckboxField
            key={topic}
            name={topic}
            label={notificationTopicDetails[topic].label}
            hint={notificationTopicDetails[topic].description}
            defaultChecked={settings[topic]}
          />
        ))}
      </fieldset>
      <FormStatus status={state.status} message={state.message} />
      <div>
        <SubmitButton pending={pending}>Save e-mail settings</SubmitButton>
      </div>
    </form>
  );
}
