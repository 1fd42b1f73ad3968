import type { Metadata } from "next";
import Link from "next/link";
import { SafetyNotice } from "@/components/safety-notice";
import { getRunFormChoices } from "@/db/queries/runs";
import { requirePagePermission } from "@/lib/session";
import { RunForm } from "../_components/run-form";

export const metadata: Metadata = { title: "New test run" };

export default async function NewRunPage() {
  const user = await requirePagePermission("workspace:use", "/workspace/runs/new");
  const choices = await getRunFormChoices({ viewer: user });
  const missing = [
    choices.labs.length === 0 ? "a lab you belong to" : null,
    choices.tools.length === 0 ? "a tool in the catalogue" : null,
    choices.protocolVersions.length === 0 ? "a test protocol" : null,
    choices.instruments.length === 0 ? "an instrument in the register" : null,
  ].filter((item) => item !== null);
  return (
    <section className="max-w-4xl space-y-6">
      <p className="text-sm">
        <Link href="/workspace/runs" className="text-verdigris-deep hover:text-copper">
          ← Test runs
        </Link>
      </p>
      <h1 className="font-serif text-3xl">New test run</h1>
      <SafetyNotice />
      {missing.length ? (
        <p className="rounded border border-copper bg-copper-wash/60 px-4 py-3 text-sm">A run needs {missing.join(", ")} first.</p>
      ) : (
        <RunForm
          choices={{
            labs: choices.labs,
            tools: choices.tools,
            protocolVersions: choices.protocolVersions,
            instruments: choices.instruments,
          }}
        />
      )}
    </section>
  );
}
