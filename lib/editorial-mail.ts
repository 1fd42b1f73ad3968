import type { DecisionKind, RevisionKind } from "@/db/schema";
import { formatDateTime } from "@/lib/format";
import type { MailMessage } from "@/lib/mail-templates";

// The desk's notifications: to editors when something waits for them, to reviewers when the desk decided.

export function submissionMail({
  origin,
  editorName,
  reportId,
  title,
  authorName,
  revision,
}: {
  origin: string;
  editorName: string;
  reportId: string;
  title: string;
  authorName: string;
  revision: { number: number; kind: RevisionKind; changeNote: string } | null;
}): MailMessage {
  const what = revision
    ? `proposed revision ${revision.number} (${revision.kind}) of the published report “${title}”.\n\nTheir note: ${revision.changeNote}`
    : `submitted “${title}” for review.`;
  return {
    subject: revision ? `Revision ${revision.number} proposed: ${title}` : `Submitted for review: ${title}`,
    text: [`Hello ${editorName},`, "", `${authorName} ${what}`, "", `On the desk: ${origin}/desk/reports/${reportId}`, "", "Benchplate"].join("\n"),
  };
}

export function decisionMail({
  origin,
  authorName,
  reportId,
  slug,
  title,
  decision,
  notes,
  revisionNumber,
  publishAt,
}: {
  origin: string;
  authorName: string;
  reportId: string;
  slug: string;
  title: string;
  decision: DecisionKind;
  notes: string;
  revisionNumber: number | null;
  publishAt: Date | null;
}): MailMessage {
  const revision = revisionNumber && revisionNumber > 1 ? `Revision ${revisionNumber} of “${title}”` : `“${title}”`;
  const { subject, news, link } = {
    approve: {
      subject: revisionNumber && revisionNumber > 1 ? `Revision ${revisionNumber} published: ${title}` : `Published: ${title}`,
      news: `${revision} is published.`,
      link: `${origin}/reports/${slug}`,
    },
    schedule: {
      subject: `Scheduled: ${title}`,
      news: `${revision} is approved and will be published on ${publishAt ? formatDateTime(publishAt) : "the chosen date"}.`,
      link: `${origin}/workspace/reports/${reportId}`,
    },
    send_back: { subject: `Sent back with notes: ${title}`, news: `The desk sent ${revision} back for changes.`, link: `${origin}/workspace/reports/${reportId}` },
    reject_revision: {
      subject: `Revision declined: ${title}`,
      news: `The desk declined ${revision}; the published version stays as it was.`,
      link: `${origin}/workspace/reports/${reportId}`,
    },
    retract: { subject: `Retracted: ${title}`, news: `The desk retracted “${title}”. It stays readable with the reason shown.`, link: `${origin}/reports/${slug}` },
  }[decision];
  return {
    subject,
    text: [`Hello ${authorName},`, "", news, ...(notes ? ["", `The editor's notes: ${notes}`] : []), "", link, "", "Benchplate"].join("\n"),
  };
}

export function pendingCommentMail({
  origin,
  editorName,
  reportTitle,
  commenterName,
  body,
}: {
  origin: string;
  editorName: string;
  reportTitle: string;
  commenterName: string;
  body: string;
}): MailMessage {
  const excerpt = body.length > 600 ? `${body.slice(0, 600)}…` : body;
  return {
    subject: `Comment waiting for moderation: ${reportTitle}`,
    text: [
      `Hello ${editorName},`,
      "",
      `${commenterName} commented on “${reportTitle}”. The comment stays hidden until an editor approves it:`,
      "",
      excerpt,
      "",
      `Moderate: ${origin}/desk/comments`,
      "",
      "Benchplate",
    ].join("\n"),
  };
}
