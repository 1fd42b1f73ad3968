import type { Metadata } from "next";
import { PlannedSection } from "@/components/planned-section";
import { requirePagePermission } from "@/lib/session";

export const metadata: Metadata = { title: "Bench workspace" };

export default async function WorkspacePage() {
  const user = await requirePagePermission("workspace:use", "/workspace");
  return (
    <PlannedSection
      title="Bench workspace"
      intro={`Signed in as ${user.name}. The workspace is where a tool on the bench becomes a report ready for the editor.`}
      items={[
        "Tools and their ratings, instruments with accuracy and calibration dates, and versioned test protocols.",
        "Test runs with capture uploads, column mapping and background analysis.",
        "Reports in MDX that embed verdicts, waveforms and harmonic charts.",
      ]}
    />
  );
}
