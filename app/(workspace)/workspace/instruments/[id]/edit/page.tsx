import type { Metadata } from "next";
import { BackLink } from "@/components/back-link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { getInstrumentForEditing, listLabsForInstruments } from "@/db/queries/instruments";
import { requirePagePermission } from "@/lib/session";
import { instrumentFormDefaults } from "../../_components/instrument-form-defaults";
import { InstrumentForm } from "../../_components/instrument-form";

export const metadata: Metadata = { title: "Edit instrument" };

export default async function EditInstrumentPage({ params }: PageProps<"/workspace/instruments/[id]/edit">) {
  const { id } = await params;
  const user = await requirePagePermission("workspace:use", `/workspace/instruments/${id}/edit`);
  if (!z.uuid().safeParse(id).success) notFound();
  // Scoped to the registers the user keeps: another lab's instrument is simply not found.
  const [instrument, labs] = await Promise.all([getInstrumentForEditing({ id, user }), listLabsForInstruments({ user })]);
  if (!instrument) notFound();
  return (
    <section className="max-w-3xl space-y-6">
      <BackLink href="/workspace/instruments">Instruments register</BackLink>
      <h1 className="font-serif text-3xl">
        {instrument.maker} {instrument.model} <span className="figure text-xl text-ink-soft">#{instrument.serialNumber}</span>
      </h1>
      <p className="text-sm text-ink-soft">Runs already made keep the spec and calibration they recorded; changes here apply to new runs.</p>
      <InstrumentForm labs={labs} defaults={instrumentFormDefaults(instrument)} id={instrument.id} />
    </section>
  );
}
