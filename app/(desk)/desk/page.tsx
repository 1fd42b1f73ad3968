import type { Metadata } from "next";
import Link from "next/link";
import { PlannedSection } from "@/components/planned-section";
import { requirePagePermission } from "@/lib/session";

export const metadata: Metadata = { title: "Editor's desk" };

export default async function DeskPage() {
  const user = await requirePagePermission("desk:use", "/desk");
  return (
    <div className="space-y-8">
      <PlannedSection
        title="Editor's desk"
        intro={`Signed in as ${user.name}. Editors decide what is published and keep the conversation clean.`}
        items={[
          "The queue of submitted reports with their data and verdicts; approve, schedule or send back.",
          "Corrections and retractions, each kept as its own revision.",
          "Comment moderation.",
        ]}
      />
      <nav aria-label="Desk" className="max-w-3xl">
        <ul className="grid gap-3 sm:grid-cols-2">
          <li>
            <Link href="/desk/requests" className="block rounded border border-rule bg-paper-raised p-4 hover:border-copper">
              <span className="font-serif text-lg">Measurement requests</span>
              <span className="block text-sm text-ink-soft">Plan, decline, merge duplicates, link the answering report.</span>
            </Link>
          </li>
          <li>
            <Link href="/desk/audit" className="block rounded border border-rule bg-paper-raised p-4 hover:border-copper">
              <span className="font-serif text-lg">Audit log</span>
              <span className="block text-sm text-ink-soft">Every editorial, moderation and account action.</span>
            </Link>
          </li>
        </ul>
      </nav>
    </div>
  );
}
