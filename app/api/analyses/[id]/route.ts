import { NextResponse } from "next/server";
import { getAnalysisStatus } from "@/db/queries/captures";
import { UserFacingError } from "@/lib/errors";
import { handleRoute } from "@/lib/route-handler";
import { analysisIdSchema } from "@/lib/validations/runs";

/** Polled by the capture page while an analysis is queued or running. */
export async function GET(_request: Request, { params }: RouteContext<"/api/analyses/[id]">) {
  return handleRoute("GET /api/analyses/[id]", analysisIdSchema, await params, async ({ id }, user) => {
    const analysis = await getAnalysisStatus({ id, viewer: user! });
    if (!analysis) throw new UserFacingError("No analysis of yours has that id.", 404);
    return NextResponse.json(
      {
        id: analysis.id,
        status: analysis.status,
        error: analysis.error,
        analysisVersion: analysis.analysisVersion,
        startedAt: analysis.startedAt,
        finishedAt: analysis.finishedAt,
      },
      { headers: { "Cache-Control": "no-store" } },
    );
  });
}
