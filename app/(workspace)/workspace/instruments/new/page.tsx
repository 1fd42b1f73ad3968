import type { Metadata } from "next";
import Link from "next/link";
import { listLabsForInstruments } from "@/db/queries/instruments";
import { requirePagePermission } from "@/lib/session";
import { InstrumentForm } from "../_components/instrument-form";

export const metadata: Metadata = { title: "New instrument" };

export default async function NewInstrumentPage() {
  const user = await requirePagePermission("workspace:use", "/workspace/instruments/new");
  const labs = await listLabsForInstruments({ user });
  return (
    <section className="max-w-3xl space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/workspace/instruments" className="text-verdigris-deep hover:text-copper">
          ← Instruments register
        </Link>
      </nav>
      <h1 className="font-serif text-3xl">New instrument</h1>
      <InstrumentForm labs={labs} defaults={{ labId: labs[0]?.id ?? "" }} />
    </section>
  );
}
