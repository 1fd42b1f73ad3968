import "server-only";
import { z } from "zod";
import type { Transaction } from "@/db";
import { insertAuditEntry } from "@/db/queries/audit";

/**
 * What the audit log records, with the label the log page shows. Editorial and moderation actions join this list as
 * they are built; every entry is written inside the transaction of the change it records, so a change that rolls back
 * leaves no entry and no committed change lacks one.
 */
export const auditActionLabels = {
  "user.role_changed": "Role changed",
  "account.deleted": "Account deleted",
  "request.status_changed": "Request status changed",
  "request.merged": "Request merged into another",
  // editorial desk, publishing, comments
  "report.published": "Report published",
  "report.scheduled": "Report scheduled for publication",
  "report.sent_back": "Sent back to the reviewer",
  "report.retracted": "Report retracted",
  "report.revision_proposed": "Revision proposed",
  "report.maker_reply_attached": "Maker's reply attached",
  "comment.moderated": "Comment moderated",
  "user.commenter_trust_changed": "Commenter trust changed",
} as const satisfies Record<string, string>;

export type AuditAction = keyof typeof auditActionLabels;

export const auditSubjectLabels = {
  user: "Account",
  measurement_request: "Measurement request",
  report: "Report",
  comment: "Comment",
} as const satisfies Record<string, string>;

export type AuditSubjectType = keyof typeof auditSubjectLabels;

export const auditLogQuerySchema = z.object({
  action: z
    .string()
    .refine((value): value is AuditAction => Object.hasOwn(auditActionLabels, value), "Unknown action filter.")
    .optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
});

export async function recordAudit(
  tx: Transaction,
  {
    actorId,
    action,
    subjectType,
    subjectId,
    details = {},
  }: { actorId: string | null; action: AuditAction; subjectType: AuditSubjectType; subjectId: string | null; details?: Record<string, unknown> },
) {
  return insertAuditEntry(tx, { actorId, action, subjectType, subjectId, details });
}
