import "server-only";
import { getReadableReport } from "@/db/queries/editorial";
import { serverEnv } from "@/lib/env";
import { UserFacingError } from "@/lib/errors";
import { measurementsDownloadPath, openDataCsv, openDataDocument, openDataFileName, type OpenDataDocument } from "@/lib/open-data";
import { loadPublishedRevision } from "@/lib/published-reports";
import { flattenPublishedResults } from "@/lib/published-results";
import { handleRoute } from "@/lib/route-handler";
import { measurementsDownloadParamsSchema } from "@/lib/validations/open-data";

export type MeasurementsDownload = {
  document: OpenDataDocument;
  /** Changes exactly when the files do: with a new current revision, or with the retraction. */
  etag: string;
  lastModified: Date;
};

/** The current published revision's measurements as open data; null for a report readers cannot see. */
export async function loadMeasurementsDownload({ slug }: { slug: string }): Promise<MeasurementsDownload | null> {
  const report = await getReadableReport({ slug });
  if (!report) return null;
  const revision = await loadPublishedRevision({ slug, reportId: report.id, revisionId: report.publishedRevisionId });
  if (!revision) return null;

  const retracted = report.status === "retracted";
  const results = flattenPublishedResults({
    report: { slug, status: retracted ? "retracted" : "published", retractionReason: report.retractionReason },
    revision: { id: revision.id, number: revision.number, kind: revision.kind, publishedAt: revision.publishedAt },
    content: revision.content,
  });
  const origin = serverEnv().APP_ORIGIN;
  const document = openDataDocument({
    report: {
      slug,
      title: revision.content.title,
      authorName: revision.content.author.name,
      url: `${origin}/reports/${slug}`,
      revision: { number: revision.number, kind: revision.kind, publishedAt: revision.publishedAt, url: `${origin}/reports/${slug}/revisions/${revision.number}` },
      retracted,
      retractionReason: retracted ? report.retractionReason : null,
    },
    results,
    downloads: { csv: `${origin}${measurementsDownloadPath(slug, "csv")}`, json: `${origin}${measurementsDownloadPath(slug, "json")}` },
  });
  const publishedAt = new Date(revision.publishedAt);
  return {
    document,
    etag: `"${revision.id}${retracted ? "-retracted" : ""}"`,
    lastModified: retracted && report.retractedAt && report.retractedAt > publishedAt ? report.retractedAt : publishedAt,
  };
}

/** Both download routes: parse the address, load the current revision's records, answer in the route's format. */
export async function answerMeasurementsDownload(request: Request, params: unknown, format: "csv" | "json"): Promise<Response> {
  return handleRoute(`GET /reports/[slug]/measurements.${format}`, measurementsDownloadParamsSchema, params, async ({ slug }) => {
    const download = await loadMeasurementsDownload({ slug });
    if (!download) throw new UserFacingError("No published report has that address.", 404);
    return measurementsDownloadResponse(request, download, format);
  });
}

/** The download as an HTTP answer, or 304 when the reader's copy is still the current one. */
function measurementsDownloadResponse(request: Request, download: MeasurementsDownload, format: "csv" | "json"): Response {
  const { document } = download;
  const headers = new Headers({
    ETag: download.etag,
    "Last-Modified": download.lastModified.toUTCString(),
    // Short: a correction or a retraction changes the files, and the ETag makes a re-check cheap.
    "Cache-Control": "public, max-age=300, must-revalidate",
    Link: `<${document.metadata.licence.url}>; rel="license"`,
  });
  if (request.headers.get("if-none-match") === download.etag) return new Response(null, { status: 304, headers });
  const fileName = openDataFileName({ slug: document.metadata.report.slug, retracted: document.metadata.retracted, revision: document.metadata.revision }, format);
  headers.set("Content-Disposition", `attachment; filename="${fileName}"`);
  if (format === "csv") {
    headers.set("Content-Type", "text/csv; charset=utf-8; header=present");
    return new Response(openDataCsv(document.metadata.columns, document.records), { headers });
  }
  headers.set("Content-Type", "application/json; charset=utf-8");
  return new Response(`${JSON.stringify(document, null, 2)}\n`, { headers });
}
