import { NextResponse } from "next/server";
import { getReport, loadReportEmbeds } from "@/db/queries/reports";
import { UserFacingError } from "@/lib/errors";
import { checkEmbedReferences, compileSafeMdx } from "@/lib/mdx/compile";
import { handleRoute } from "@/lib/route-handler";
import { reportPreviewSchema } from "@/lib/validations/reports";

/**
 * The live preview: the editor's unsaved MDX through the same sanitising compiler the saved report uses. Answers the
 * sanitised tree (plain JSON, rendered in the browser with the same components), the problems with line and column,
 * and the report's cited data for its embeds.
 */
export async function POST(request: Request, { params }: RouteContext<"/api/reports/[id]/preview">) {
  const body: unknown = await request.json().catch(() => null);
  const input = { ...(typeof body === "object" && body !== null ? body : {}), reportId: (await params).id };
  return handleRoute("POST /api/reports/[id]/preview", reportPreviewSchema, input, async ({ reportId, source }, user) => {
    if (!user) throw new UserFacingError("Sign in first.", 401);
    const report = await getReport({ id: reportId, viewer: user });
    if (!report) throw new UserFacingError("No report of yours has that id.", 404);
    const compiled = compileSafeMdx(source);
    const embeds = await loadReportEmbeds({ reportId });
    const known = {
      analysisLabels: Object.keys(embeds.analyses),
      imageNames: Object.keys(embeds.images),
      toolSlugs: embeds.tools.map((tool) => tool.slug),
    };
    const problems = [...compiled.problems, ...checkEmbedReferences(compiled.references, known)].sort(
      (a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0),
    );
    return NextResponse.json({ tree: compiled.tree, problems, embeds }, { headers: { "Cache-Control": "no-store" } });
  });
}
