import { z } from "zod";
import { searchText, withoutBlankParams } from "@/lib/validations/form-fields";

/** The report search's query string: the words as typed (websearch syntax: "quoted phrase", or, -word) and the page. */
export const reportSearchSchema = z.preprocess(
  withoutBlankParams,
  z.object({
    q: searchText(200, "Search for at most 200 characters.").default(""),
    page: z.coerce.number().int("page must be a whole number").min(1, "page starts at 1").max(1_000, "page is at most 1000").default(1),
  }),
);

export type ReportSearch = z.infer<typeof reportSearchSchema>;
