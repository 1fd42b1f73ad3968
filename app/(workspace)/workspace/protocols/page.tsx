import type { Metadata } from "next";
import { listProtocols } from "@/db/queries/protocols";
import { isoDateOf } from "@/lib/calibration";
import { requirePagePermission } from "@/lib/session";
import { ProtocolsTable } from "./_components/protocols-table";

export const metadata: Metadata = { title: "Test protocols" };

export default async function ProtocolsPage() {
  const user = await requirePagePermission("workspace:use", "/workspace/protocols");
  const protocols = await listProtocols({ user });
  return (
    <section className="space-y-4">
      <h1 className="font-serif text-3xl">Test protocols</h1>
      <p className="max-w-2xl text-sm text-ink-soft">
        How each test is done. Revising a protocol adds a new version; runs keep the version they were made under, word for word.
      </p>
      <ProtocolsTable
        protocols={protocols.map((protocol) => ({
          slug: protocol.slug,
          name: protocol.name,
          supply: `${protocol.conditions.supplyVoltage} V ${protocol.conditions.supplyFrequencyHz} Hz`,
          version: protocol.version,
          revisedOn: isoDateOf(protocol.revisedAt),
          revisedBy: protocol.revisedBy ?? "—",
          revisable: protocol.revisable,
        }))}
      />
    </section>
  );
}
