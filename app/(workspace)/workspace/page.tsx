import type { Metadata } from "next";
import Link from "next/link";
import { requirePagePermission } from "@/lib/session";

export const metadata: Metadata = { title: "Bench workspace" };

// In the order the work happens: what is tested and with what, then the runs, then the write-up.
const sections = [
  { href: "/workspace/tools", title: "Tools catalogue", text: "Tools with their ratings as the maker states them, accessories and photos." },
  { href: "/workspace/instruments", title: "Instruments register", text: "Meters, scopes, clamps and probes with accuracy per range and calibration dates." },
  { href: "/workspace/protocols", title: "Test protocols", text: "How each test is done: conditions, measurements, tolerances, steps and cautions, in versions." },
  { href: "/workspace/runs", title: "Test runs", text: "One tool under one protocol version: captures, readings, analyses and verdicts." },
  { href: "/workspace/reports", title: "Reports", text: "Write-ups in MDX that embed the analyses, ready for the editor." },
] as const;

export default async function WorkspacePage() {
  const user = await requirePagePermission("workspace:use", "/workspace");
  return (
    <section className="space-y-6">
      <header className="max-w-3xl space-y-2">
        <h1 className="font-serif text-3xl">Bench workspace</h1>
        <p className="text-ink-soft">Signed in as {user.name}. The workspace is where a tool on the bench becomes a report ready for the editor.</p>
      </header>
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {sections.map((section) => (
          <li key={section.href}>
            <Link href={section.href} className="block h-full rounded border border-rule bg-paper-raised p-4 hover:border-copper">
              <span className="font-serif text-xl text-ink">{section.title}</span>
              <span className="mt-1 block text-sm text-ink-soft">{section.text}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
