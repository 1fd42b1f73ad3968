import type { Metadata } from "next";
import { PlannedSection } from "@/components/planned-section";
import { requirePagePermission } from "@/lib/session";

export const metadata: Metadata = { title: "Editor's desk" };

export default async function DeskPage() {
  const user = await requirePagePermission("desk:use", "/desk");
  return (
    <PlannedSection
      title="Editor's desk"
      intro={`Signed in as ${user.name}. Editors decide what is published and keep the conversation clean.`}
      items={[
        "The queue of submitted reports with their data and verdicts; approve, schedule or send back.",
        "Corrections and retractions, each kept as its own revision.",
        "Comment moderation and triage of readers' measurement requests.",
      ]}
    />
  );
}
