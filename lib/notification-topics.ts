import type { Role } from "@/lib/authz";

// Shared by the outbox (server) and the preferences form (client), so it holds no server-only code.

/** What a notification e-mail is about; each can be switched off per person. */
export const notificationTopics = ["submission", "decision", "moderation", "request_update"] as const;
export type NotificationTopic = (typeof notificationTopics)[number];

/** Account mail (welcome, password reset) is not a notification: it is always sent and carries no unsubscribe link. */
export type MailTopic = NotificationTopic | "account";

export const notificationTopicDetails: Record<
  NotificationTopic,
  { label: string; description: string; audience: readonly Role[] }
> = {
  submission: {
    label: "Reports submitted for review",
    description: "A reviewer submitted a report or a revision to the editor's desk.",
    audience: ["editor"],
  },
  decision: {
    label: "Editorial decisions on my reports",
    description: "An editor approved, scheduled or sent back one of your reports.",
    audience: ["reviewer", "editor"],
  },
  moderation: {
    label: "Comments waiting for moderation",
    description: "A reader's comment waits for approval.",
    audience: ["editor"],
  },
  request_update: {
    label: "Measurement requests I asked for or voted on",
    description: "A request you asked for or voted on was planned, measured, declined or merged.",
    audience: ["reader", "reviewer", "editor", "admin"],
  },
};

export function topicsForRole(role: Role): NotificationTopic[] {
  return notificationTopics.filter((topic) => notificationTopicDetails[topic].audience.includes(role));
}

export function isNotificationTopic(value: string): value is NotificationTopic {
  return (notificationTopics as readonly string[]).includes(value);
}
