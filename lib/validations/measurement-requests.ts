import { z } from "zod";
import { requestStatuses } from "@/lib/request-statuses";
import { optionalText, requiredText } from "@/lib/validations/form-fields";


/** Requests a reader may post in any 24 hours: enough to ask for what they need, too few to flood the list. */
export const requestLimits = { perDay: 5, listPageSize: 20 } as const;

const requestId = (message: string) => z.uuid(message);

// Empty gets the field's own message; a few words get asked for more, never both at once.
const explainedText = (required: string, max: number) =>
  requiredText(required, max).refine((text) => text.length === 0 || text.length >= 10, "Say a little more: at least 10 characters.");

export const newMeasurementRequestSchema = z
  .object({
    toolId: z.preprocess((value) => (value === "" ? undefined : value), z.uuid("Choose a tool from the list.").optional()),
    proposedToolName: optionalText(120),
    whatToMeasure: explainedText("Say what you would like measured.", 1000),
    why: explainedText("Say why the measurement matters to you.", 2000),
  })
  .superRefine((values, context) => {
    if (!values.toolId && !values.proposedToolName) {
      context.addIssue({
        code: "custom",
        path: ["toolId"],
        message: "Choose a catalogued tool, or name one that is not in the catalogue yet.",
      });
    }
    if (values.toolId && values.proposedToolName) {
      context.addIssue({
        code: "custom",
        path: ["proposedToolName"],
        message: "Either choose a catalogued tool or name a new one, not both.",
      });
    }
  });

export const requestVoteSchema = z.object({ requestId: requestId("Unknown request.") });

/** Measured is set by linking the answering report (requestFulfilmentSchema), never by choosing the status alone. */
export const requestStatusChangeSchema = z
  .object({
    requestId: requestId("Unknown request."),
    status: z.enum(["open", "planned", "declined"], { message: "Choose open, planned or declined." }),
    declineReason: optionalText(500),
  })
  .superRefine((values, context) => {
    if (values.status === "declined" && (values.declineReason?.length ?? 0) < 10) {
      context.addIssue({
        code: "custom",
        path: ["declineReason"],
        message: "Say why the request is declined (at least 10 characters): the requester and voters will read it.",
      });
    }
  });

export const requestFulfilmentSchema = z.object({
  requestId: requestId("Unknown request."),
  reportId: requestId("Choose the report that answers this request."),
});

export const requestMergeSchema = z
  .object({
    duplicateId: requestId("Unknown request."),
    targetId: requestId("Choose the request this one duplicates."),
  })
  .refine((values) => values.duplicateId !== values.targetId, {
    path: ["targetId"],
    message: "A request cannot be merged into itself.",
  });

export const requestListQuerySchema = z.object({
  status: z.enum(["wanted", ...requestStatuses], { message: "Unknown status filter." }).default("wanted"),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
});

export type RequestListQuery = z.infer<typeof requestListQuerySchema>;

/** A page's search parameters as a list query; anything malformed falls back to the default list, with the reason. */
export function parseRequestListQuery(raw: Record<string, string | string[] | undefined>) {
  const parsed = requestListQuerySchema.safeParse({
    status: typeof raw.status === "string" && raw.status !== "" ? raw.status : undefined,
    page: typeof raw.page === "string" ? raw.page : undefined,
  });
  const query = parsed.success ? parsed.data : requestListQuerySchema.parse({});
  const hrefFor = (page: number) => ({ query: { ...(query.status === "wanted" ? {} : { status: query.status }), page } });
  return { query, problem: parsed.success ? null : (parsed.error.issues[0]?.message ?? null), hrefFor };
}
