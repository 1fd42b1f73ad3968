import type { Metadata } from "next";
import { BackLink } from "@/components/back-link";
import { listLabsForInstruments } from "@/db/queries/instruments";
import { requirePagePermission } from "@/lib/session";
import { InstrumentForm } from "../_components/instrument-form";

export const metadata: Metadata = { title: "New instrument" };

export default async function NewInstrumentPage() {
  const user = await requirePagePermission("workspace:use", "/workspace/instruments/new");
  const labs = await listLabsForInstruments({ user });
  return (
    <section className="max-w-3xl space-y-6">
      <BackLink href="/workspace/instruments">Instruments register</BackLink>
      <h1 className="font-serif text-3xl">New instrument</h1>
      <InstrumentForm labs={labs} defaults={{ labId: labs[0]?.id ?? "" }} />
    </section>
  );
}
