import { z } from "zod";
import { withIndexedRows } from "@/lib/form-data";
import { MAX_MDX_LENGTH, referenceNamePattern } from "@/lib/mdx/policy";
import { checkboxField, dateField, optionalText, requiredText } from "@/lib/validations/form-fields";

// Shared by the desk's and the reviewer's forms (checked in the browser first) and the server actions.

const reportId = z.uuid("Unknown report.");

// Empty gets the field's own message; a few words get asked for more, never both at once.
const explained = (required: string, max: number, min = 10) =>
  requiredText(required, max).refine((text) => text.length === 0 || text.length >= min, `Say a little more: at least ${min} characters.`);

export const publishReportSchema = z.object({ reportId, notes: optionalText(2000).transform((value) => value ?? "") });

/** A moment typed into a datetime-local field, read as UTC (the form says so), at least a minute ahead. */
const futureMoment = z
  .string({ error: "Choose the date and time to publish." })
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "Choose the date and time to publish.")
  .transform((value) => new Date(`${value}:00Z`))
  .refine((moment) => !Number.isNaN(moment.getTime()), "That is not a real date.")
  .refine((moment) => moment.getTime() > Date.now() + 60_000, "Choose a moment in the future (UTC); to publish now, use Publish now.");

export const scheduleReportSchema = z.object({
  reportId,
  publishAt: futureMoment,
  notes: optionalText(2000).transform((value) => value ?? ""),
});

export const sendBackSchema = z.object({
  reportId,
  notes: explained("Tell the reviewer what to change.", 4000),
});

export const retractReportSchema = z.object({
  reportId,
  reason: explained("Give the reason for the retraction; readers see it on the report.", 2000, 20),
});

export const makerReplySchema = z.object({
  reportId,
  makerName: requiredText("Name the maker who replied.", 120),
  receivedOn: dateField("Give the date the reply was received."),
  body: explained("Paste the maker's reply.", 8000),
});

export const revisionKinds = ["correction", "amendment"] as const;

export const revisionKindLabels: Record<(typeof revisionKinds)[number] | "original", string> = {
  original: "Original",
  correction: "Correction",
  amendment: "Amendment",
};

/** A revision of a published report: its text, the citations it repoints, and why. */
export const proposeRevisionSchema = z.preprocess(
  (input) => withIndexedRows(input, ["citations"]),
  z.object({
    reportId,
    kind: z.enum(revisionKinds, { message: "Say whether a finding changes (a correction) or not (an amendment)." }),
    changeNote: explained("Say what changed and why; readers see this note.", 2000),
    title: requiredText("Give the report a title.", 160),
    disclosure: optionalText(4000).transform((value) => value ?? ""),
    bodyMdx: z
      .string({ error: "Write the body of the report." })
      // A browser sends a textarea's lines ending in CR LF; kept as typed, every line would differ from the last revision.
      .transform((body) => body.replace(/\r\n?/g, "\n"))
      .pipe(
        z
          .string()
          .max(MAX_MDX_LENGTH, `The body is limited to ${MAX_MDX_LENGTH} characters.`)
          .refine((body) => body.trim() !== "", "Write the body of the report."),
      ),
    citations: z
      .array(z.object({ label: z.string().regex(referenceNamePattern, "Unknown citation."), analysisId: z.uuid("Choose a finished analysis.") }))
      .max(40),
  }),
);

export const commentLimits = { perWindow: 5, windowMinutes: 10, maxLength: 4000 } as const;

export const postCommentSchema = z.object({
  reportId,
  parentId: z.preprocess((value) => (value === "" ? undefined : value), z.uuid("Unknown comment.").optional()),
  body: requiredText("Write your comment.", commentLimits.maxLength).refine((text) => text.length === 0 || text.length >= 2, "Write a little more."),
});

export const commentStatusLabels = { pending: "Waiting", approved: "Approved", rejected: "Rejected", spam: "Spam" } as const;

export const moderateCommentSchema = z.object({
  commentId: z.uuid("Unknown comment."),
  status: z.enum(["approved", "rejected", "spam"], { message: "Choose approve, reject or spam." }),
});

export const commenterTrustSchema = z.object({
  userId: z.uuid("Unknown account."),
  trusted: checkboxField,
});
