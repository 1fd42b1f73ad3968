import type { MetadataRoute } from "next";
import { serverEnv } from "@/lib/env";

export const dynamic = "force-dynamic";

/** Readers' pages are for everyone; the working areas behind sign-in are not for crawlers. */
export default function robots(): MetadataRoute.Robots {
  const origin = serverEnv().APP_ORIGIN;
  return {
    rules: { userAgent: "*", allow: "/", disallow: ["/account", "/workspace", "/desk", "/admin", "/api/", "/unsubscribe/"] },
    sitemap: `${origin}/sitemap.xml`,
  };
}
