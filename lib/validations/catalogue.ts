import { z } from "zod";
import { optionalNumberField, searchText, withoutBlankParams } from "@/lib/validations/form-fields";

export const toolCategories = ["hot_air_station", "soldering_station", "rework_station", "heat_gun"] as const;

export const toolCategoryLabels: Record<(typeof toolCategories)[number], string> = {
  hot_air_station: "Hot-air rework station",
  soldering_station: "Soldering station",
  rework_station: "Combined rework station",
  heat_gun: "Heat gun",
};

/**
 * Mains supplies a reader may have at the bench, by nominal voltage. A tool belongs to a band when its rated voltage,
 * or its rated range, includes the nominal: a 220–240 V tool is a 230 V tool, a 100–120 V one a 120 V tool.
 */
export const voltageBands = { "230": 230, "120": 120 } as const satisfies Record<string, number>;
export type VoltageBand = keyof typeof voltageBands;
const voltageBandKeys = Object.keys(voltageBands) as [VoltageBand, ...VoltageBand[]];

export const voltageBandLabels: Record<VoltageBand, string> = { "230": "230 V mains", "120": "120 V mains" };

/** Whether a tool has results in a current published report (retracted reports do not count). */
export const publishedResultChoices = ["yes", "no"] as const;
export const publishedResultLabels: Record<(typeof publishedResultChoices)[number], string> = {
  yes: "With published results",
  no: "Not yet tested",
};

export const catalogueSorts = ["name", "ratedPower", "price", "newestResult"] as const;
export type CatalogueSort = (typeof catalogueSorts)[number];
export const sortOrders = ["asc", "desc"] as const;
export type SortOrder = (typeof sortOrders)[number];

/** Newest results first is what a reader means by sorting on them; every other column reads smallest first. */
export function defaultSortOrder(sort: CatalogueSort): SortOrder {
  return sort === "newestResult" ? "desc" : "asc";
}

export const catalogueDefaultPerPage = 24;

const wattsField = optionalNumberField(
  (field) => field.min(0, "Enter watts from 0 to 100000.").max(100_000, "Enter watts from 0 to 100000."),
  "Enter a number of watts, such as 600.",
);

/**
 * The catalogue's filters, sort and page, as GET /api/tools and the /tools page read them from the query string.
 * Every parameter is optional; an empty one counts as not given.
 */
export const catalogueQuerySchema = z.preprocess(
  withoutBlankParams,
  z
    .object({
      q: searchText(100, "Search text is limited to 100 characters.").optional(),
      category: z.enum(toolCategories, { message: `category must be one of: ${toolCategories.join(", ")}` }).optional(),
      maker: z
        .string()
        .trim()
        .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, "maker is a maker's short name as in its address, such as quillfern-thermal")
        .max(100, "maker is at most 100 characters")
        .optional(),
      minPowerW: wattsField,
      maxPowerW: wattsField,
      voltage: z.enum(voltageBandKeys, { message: `voltage must be one of: ${voltageBandKeys.join(", ")}` }).optional(),
      published: z.enum(publishedResultChoices, { message: `published must be one of: ${publishedResultChoices.join(", ")}` }).optional(),
      sort: z.enum(catalogueSorts, { message: `sort must be one of: ${catalogueSorts.join(", ")}` }).default("name"),
      order: z.enum(sortOrders, { message: "order must be asc or desc" }).optional(),
      page: z.coerce.number().int("page must be a whole number").min(1, "page starts at 1").max(10_000).default(1),
      perPage: z.coerce.number().int("perPage must be a whole number").min(1).max(100, "perPage is at most 100").default(catalogueDefaultPerPage),
    })
    .refine((query) => query.minPowerW === null || query.maxPowerW === null || query.minPowerW <= query.maxPowerW, {
      path: ["maxPowerW"],
      message: "The upper rated power must be at least the lower one.",
    }),
);

export type CatalogueQuery = z.infer<typeof catalogueQuerySchema>;

/** What a caller outside the query string must say: the page; filters and sort are optional there. */
export type CatalogueRequest = Pick<CatalogueQuery, "page" | "perPage"> & Partial<Omit<CatalogueQuery, "page" | "perPage">>;

/** The parameters in the order and form the /tools address carries them: only what differs from the defaults. */
export function catalogueSearchParams(query: CatalogueRequest): URLSearchParams {
  const params = new URLSearchParams();
  const set = (name: string, value: string | number | null | undefined) => {
    if (value !== null && value !== undefined && value !== "") params.set(name, String(value));
  };
  set("q", query.q);
  set("category", query.category);
  set("maker", query.maker);
  set("minPowerW", query.minPowerW);
  set("maxPowerW", query.maxPowerW);
  set("voltage", query.voltage);
  set("published", query.published);
  const sort = query.sort ?? "name";
  if (sort !== "name") set("sort", sort);
  if (query.order && query.order !== defaultSortOrder(sort)) set("order", query.order);
  if (query.page > 1) set("page", query.page);
  if (query.perPage !== catalogueDefaultPerPage) set("perPage", query.perPage);
  return params;
}
