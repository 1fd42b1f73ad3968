import type { Metadata } from "next";
import { listInstruments } from "@/db/queries/instruments";
import { isCalibrationOverdue } from "@/lib/calibration";
import { requirePagePermission } from "@/lib/session";
import { accuracyQuantityInfo, instrumentKindLabels } from "@/lib/instrument-kinds";
import { formatAccuracySpec } from "@/lib/validations/instrument";
import { InstrumentsTable } from "./_components/instruments-table";

export const metadata: Metadata = { title: "Instruments register" };

export default async function InstrumentsPage({ searchParams }: PageProps<"/workspace/instruments">) {
  const user = await requirePagePermission("workspace:use", "/workspace/instruments");
  const [instruments, { saved }] = await Promise.all([listInstruments({ user }), searchParams]);
  const overdueCount = instruments.filter((instrument) => isCalibrationOverdue(instrument.calibrationDueOn)).length;
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Instruments register</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        Each meter, scope, clamp and probe with its accuracy per range and its calibration. A run keeps a copy of the spec and
        calibration as they were on the day, so editing an entry here never changes what a past run recorded.
      </p>
      {saved === "1" ? (
        <p role="status" className="text-sm text-verdigris-deep">
          Instrument saved.
        </p>
      ) : null}
      {overdueCount ? (
        <p className="text-sm font-semibold text-copper-deep">
          {overdueCount === 1 ? "One instrument is" : `${overdueCount} instruments are`} past the calibration due date.
        </p>
      ) : null}
      <InstrumentsTable
        instruments={instruments.map((instrument) => ({
          id: instrument.id,
          name: `${instrument.maker} ${instrument.model}`,
          kind: instrumentKindLabels[instrument.kind],
          serialNumber: instrument.serialNumber,
          lab: instrument.lab ?? "—",
          accuracy: instrument.accuracy
            .map((range) => `${accuracyQuantityInfo[range.quantity].label} ≤ ${range.rangeMax} ${range.unit}: ±(${formatAccuracySpec(range)} ${range.unit})`)
            .join("\n"),
          calibrationDueOn: instrument.calibrationDueOn,
          overdue: isCalibrationOverdue(instrument.calibrationDueOn),
          editable: instrument.editable,
        }))}
      />
    </section>
  );
}
