import { serverEnv } from "@/lib/env";

export type MailMessage = { subject: string; text: string };

export function welcomeMail({ name }: { name: string }): MailMessage {
  const origin = serverEnv().APP_ORIGIN;
  return {
    subject: "Welcome to Benchplate",
    text: [
      `Hello ${name},`,
      "",
      "Your reader account is ready. You can now comment on published reports, ask for measurements you want to see, and vote on other readers' requests.",
      "",
      `Reports: ${origin}/tools`,
      "",
      "Benchplate",
    ].join("\n"),
  };
}

export function passwordResetMail({ name, token, validMinutes }: { name: string; token: string; validMinutes: number }): MailMessage {
  const link = `${serverEnv().APP_ORIGIN}/reset-password/${token}`;
  return {
    subject: "Reset your Benchplate password",
    text: [
      `Hello ${name},`,
      "",
      `Someone asked to reset the password of this account. The link below works once, for ${validMinutes} minutes:`,
      "",
      link,
      "",
      "If it was not you, ignore this message: your password stays as it is.",
    ].join("\n"),
  };
}
