import type { MetadataRoute } from "next";
import { serverEnv } from "@/lib/env";
import { loadSitemapPages } from "@/lib/reader-lists";

// Built per request (from a cached list) so the origin is the running app's, not the build machine's.
export const dynamic = "force-dynamic";

export default async function sitemap(): Promise<MetadataRoute.Sitemap> {
  const origin = serverEnv().APP_ORIGIN;
  const { reports, tools } = await loadSitemapPages();
  const page = (path: string, lastModified: string | null = null): MetadataRoute.Sitemap[number] => ({
    url: `${origin}${path}`,
    ...(lastModified ? { lastModified } : {}),
  });
  return [
    page("/"),
    page("/tools"),
    ...tools.map((tool) => page(`/tools/${tool.slug}`, tool.lastModified)),
    page("/reports"),
    ...reports.map((report) => page(`/reports/${report.slug}`, report.lastModified)),
    page("/requests"),
  ];
}
