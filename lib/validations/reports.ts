import { z } from "zod";
import { MAX_MDX_LENGTH, referenceNamePattern } from "@/lib/mdx/policy";
import { optionalText, requiredText } from "@/lib/validations/form-fields";

// Shared by the report forms (checked in the browser before sending) and the server actions and handlers.

const reportId = z.uuid("Unknown report.");

const referenceName = (what: string) =>
  z
    .string({ error: `Give the ${what} a name.` })
    .trim()
    .min(1, `Give the ${what} a name.`)
    .regex(referenceNamePattern, "Use lower-case letters, digits and hyphens, starting with a letter or digit (at most 48).");

/** One tool, or two for a head-to-head. */
const toolChoice = {
  toolId: z.uuid("Choose the tool this report is about."),
  secondToolId: z.preprocess((value) => (value === "" ? undefined : value), z.uuid("Choose a tool from the list.").optional()),
};

function distinctTools(values: { toolId?: unknown; secondToolId?: unknown }, context: z.RefinementCtx) {
  if (values.secondToolId !== undefined && values.secondToolId === values.toolId) {
    context.addIssue({ code: "custom", path: ["secondToolId"], message: "A head-to-head needs two different tools." });
  }
}

export const createReportSchema = z
  .object({ title: requiredText("Give the report a title.", 160), ...toolChoice })
  .superRefine(distinctTools);

export const updateReportSchema = z
  .object({
    reportId,
    title: requiredText("Give the report a title.", 160),
    ...toolChoice,
    disclosure: optionalText(4000).transform((value) => value ?? ""),
    bodyMdx: z.string().max(MAX_MDX_LENGTH, `The body is limited to ${MAX_MDX_LENGTH} characters.`).default(""),
  })
  .superRefine(distinctTools);

export const citeAnalysisSchema = z.object({
  reportId,
  analysisId: z.uuid("Choose a finished analysis."),
  label: referenceName("citation"),
});

export const removeCitationSchema = z.object({ reportId, label: referenceName("citation") });

export const reportImageLimits = { maxBytes: 8 * 1024 * 1024, maxWidth: 1600 } as const;

export const reportImageUploadSchema = z.object({
  reportId,
  name: referenceName("image"),
  altText: z
    .string({ error: "Describe the picture for readers who cannot see it." })
    .trim()
    .min(5, "Describe the picture for readers who cannot see it (at least 5 characters).")
    .max(300, "Keep the description under 300 characters; put the rest in the caption."),
  image: z
    .instanceof(File, { message: "Choose an image file." })
    .refine((file) => file.size > 0, "The chosen file is empty.")
    .refine((file) => file.size <= reportImageLimits.maxBytes, `Images up to ${reportImageLimits.maxBytes / 1024 / 1024} MB.`)
    .refine((file) => /^image\/(png|jpeg|webp|gif|avif)$/.test(file.type), "Use a PNG, JPEG, WebP, GIF or AVIF image."),
});

export const deleteReportImageSchema = z.object({ reportId, imageId: z.uuid("Unknown image.") });

export const submitReportSchema = z.object({ reportId });

export const reportPreviewSchema = z.object({
  reportId,
  source: z.string({ error: "Send the MDX source as text." }).max(MAX_MDX_LENGTH, `The body is limited to ${MAX_MDX_LENGTH} characters.`),
});
