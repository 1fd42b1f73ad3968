import { z } from "zod";
import { notificationTopics, type NotificationTopic } from "@/lib/notification-topics";
import { checkboxField } from "@/lib/validations/form-fields";

/** One checkbox per topic; an unticked box is absent from the form and reads as "off". */
export const notificationSettingsSchema = z.object(
  Object.fromEntries(notificationTopics.map((topic) => [topic, checkboxField])) as Record<NotificationTopic, typeof checkboxField>,
);

export const unsubscribeSchema = z.object({
  token: z.string().regex(/^[A-Za-z0-9_-]{32}$/, "This unsubscribe link is malformed."),
  topic: z.enum(notificationTopics, { message: "This unsubscribe link names no e-mail topic we send." }),
});
