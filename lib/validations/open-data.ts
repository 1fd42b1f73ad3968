import { z } from "zod";

/** A report's address segment, as the open-data downloads read it from their URL. */
export const measurementsDownloadParamsSchema = z.object({
  slug: z.string({ error: "Unknown report." }).regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, "Unknown report.").max(200, "Unknown report."),
});
