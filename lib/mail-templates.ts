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

export type RequestChange =
  | { kind: "open" | "planned" }
  | { kind: "measured"; reportTitle: string; reportPublished: boolean }
  | { kind: "declined"; reason: string }
  | { kind: "merged"; targetId: string; targetToolName: string };

export function requestUpdateMail({
  name,
  requestId,
  toolName,
  whatToMeasure,
  change,
}: {
  name: string;
  requestId: string;
  toolName: string;
  whatToMeasure: string;
  change: RequestChange;
}): MailMessage {
  const origin = serverEnv().APP_ORIGIN;
  const subject = {
    open: `Reopened: the request for ${toolName}`,
    planned: `Planned for the bench: ${toolName}`,
    measured: `Measured: ${toolName}`,
    declined: `Declined: the request for ${toolName}`,
    merged: `Merged with another request: ${toolName}`,
  }[change.kind];
  const news = (() => {
    switch (change.kind) {
      case "open":
        return "is open again: the editors will look at it anew.";
      case "planned":
        return "is planned: a reviewer will put the tool on the bench.";
      case "measured":
        return change.reportPublished
          ? `has been measured. The report that answers it: “${change.reportTitle}”.`
          : "has been measured. The report that answers it is with the editors and appears on the request's page once published.";
      case "declined":
        return `was declined. The editors' reason: ${change.reason}`;
      case "merged":
        return `asked for what another request about ${change.targetToolName} already asks, so the two were merged. Your vote now counts there.`;
    }
  })();
  const link = `${origin}/requests/${change.kind === "merged" ? change.targetId : requestId}`;
  return {
    subject,
    text: [
      `Hello ${name},`,
      "",
      `A measurement request you asked for or voted on ${news}`,
      "",
      `What was asked: ${whatToMeasure}`,
      "",
      link,
      "",
      "Benchplate",
    ].join("\n"),
  };
}
