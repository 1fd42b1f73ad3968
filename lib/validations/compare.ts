import { z } from "zod";

export const compareSides = ["a", "b"] as const;
export type CompareSide = (typeof compareSides)[number];

const toolSlugParam = z.string().regex(/^[a-z0-9-]{1,100}$/, "That is not a tool's address.");
const searchText = z.string().trim().max(100, "Search text is limited to 100 characters.");

/**
 * The compare page's whole state, read from its URL: the two tools' slugs, and (from the form that works without
 * JavaScript) the text typed into a picker, which the page resolves to a tool.
 */
export const compareQuerySchema = z.object({
  a: toolSlugParam.optional(),
  b: toolSlugParam.optional(),
  qa: searchText.optional(),
  qb: searchText.optional(),
});

export type CompareQuery = z.infer<typeof compareQuerySchema>;

/** The address of a comparison; a side left empty is left out. */
export function compareHref(slugs: Partial<Record<CompareSide, string | null>>): string {
  const params = new URLSearchParams();
  for (const side of compareSides) {
    const slug = slugs[side];
    if (slug) params.set(side, slug);
  }
  const query = params.toString();
  return query ? `/compare?${query}` : "/compare";
}
