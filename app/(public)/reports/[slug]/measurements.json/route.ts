import { answerMeasurementsDownload } from "@/lib/open-data-downloads";

export async function GET(request: Request, { params }: RouteContext<"/reports/[slug]/measurements.json">) {
  return answerMeasurementsDownload(request, await params, "json");
}
