import { answerMeasurementsDownload } from "@/lib/open-data-downloads";

export async function GET(request: Request, { params }: RouteContext<"/reports/[slug]/measurements.csv">) {
  return answerMeasurementsDownload(request, await params, "csv");
}
