import { z } from "zod";
import { publishedListsMaxAgeSeconds } from "@/lib/editorial";
import { serverEnv } from "@/lib/env";
import { loadReportFeedXml } from "@/lib/reader-lists";
import { handleRoute } from "@/lib/route-handler";

export async function GET() {
  return handleRoute("GET /feed.xml", z.object({}), {}, async () => {
    const xml = await loadReportFeedXml(serverEnv().APP_ORIGIN);
    return new Response(xml, {
      headers: {
        "Content-Type": "application/atom+xml; charset=utf-8",
        "Cache-Control": `public, max-age=${publishedListsMaxAgeSeconds}, stale-while-revalidate=${publishedListsMaxAgeSeconds * 10}`,
      },
    });
  });
}
