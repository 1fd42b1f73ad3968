import { z } from "zod";

export const toolCategories = ["hot_air_station", "soldering_station", "rework_station", "heat_gun"] as const;

export const toolCategoryLabels: Record<(typeof toolCategories)[number], string> = {
  hot_air_station: "Hot-air rework station",
  soldering_station: "Soldering station",
  rework_station: "Combined rework station",
  heat_gun: "Heat gun",
};

export const catalogueQuerySchema = z.object({
  q: z.string().trim().max(100, "Search text is limited to 100 characters.").optional(),
  category: z.enum(toolCategories, { message: `category must be one of: ${toolCategories.join(", ")}` }).optional(),
  page: z.coerce.number().int("page must be a whole number").min(1, "page starts at 1").max(10_000).default(1),
  perPage: z.coerce.number().int("perPage must be a whole number").min(1).max(100, "perPage is at most 100").default(24),
});

export type CatalogueQuery = z.infer<typeof catalogueQuerySchema>;
