"use client";

import { submitReportSchema } from "@/lib/validations/reports";
import { submitReport } from "../actions";
import { ActionForm } from "@/components/ui/action-form";

export function SubmitPanel({ reportId }: { reportId: string }) {
  return (
    <section aria-labelledby="submit-heading" className="space-y-2 rounded border border-rule bg-paper-raised p-4">
      <h2 id="submit-heading" className="font-serif text-2xl">
        Submit for review
      </h2>
      <p className="max-w-3xl text-sm text-ink-soft">
        The editors get the saved version. It needs at least one cited analysis, a body that compiles without problems, and alt text on every image;
        it is read-only for you until the desk publishes it or sends it back.
      </p>
      <ActionForm action={submitReport} schema={submitReportSchema} hidden={{ reportId }} submitLabel="Submit for review" />
    </section>
  );
}
