import { NextResponse } from "next/server";
import { loadCataloguePage } from "@/lib/catalogue-listing";
import { handleRoute, searchParamsObject } from "@/lib/route-handler";
import { catalogueQuerySchema } from "@/lib/validations/catalogue";

export async function GET(request: Request) {
  return handleRoute("GET /api/tools", catalogueQuerySchema, searchParamsObject(request.url), async (query) => {
    const { tools, total, page, perPage } = await loadCataloguePage(query);
    return NextResponse.json(tools, {
      headers: { "X-Total-Count": String(total), "X-Page": String(page), "X-Per-Page": String(perPage) },
    });
  });
}
