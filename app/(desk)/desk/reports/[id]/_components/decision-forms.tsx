"use client";

import { useState } from "react";
import { ActionForm } from "@/components/ui/action-form";
import { TextAreaField, TextField } from "@/components/ui/form-controls";
import { makerReplySchema, publishReportSchema, retractReportSchema, scheduleReportSchema, sendBackSchema } from "@/lib/validations/editorial";
import { attachMakerReply, publishReport, retractReport, scheduleReport, sendBackReport } from "../../actions";

const panel = "space-y-2 rounded border border-rule bg-paper-raised p-4";

const decisions = ["publish", "schedule", "send-back"] as const;
type Decision = (typeof decisions)[number];

/**
 * Publish now, publish later, or send back with notes. One form shows at a time, so each field keeps a single id on
 * the page.
 */
export function DecisionForms({ reportId, isRevision }: { reportId: string; isRevision: boolean }) {
  const [decision, setDecision] = useState<Decision>("publish");
  const labels: Record<Decision, string> = {
    publish: "Publish now",
    schedule: "Publish later",
    "send-back": isRevision ? "Decline the revision" : "Send back",
  };
  return (
    <section aria-labelledby="decision-heading" className={panel}>
      <h2 id="decision-heading" className="font-serif text-2xl">
        Decision
      </h2>
      <fieldset className="flex flex-wrap gap-x-5 gap-y-2">
        <legend className="sr-only">Choose the decision</legend>
        {decisions.map((choice) => (
          <label key={choice} className="flex items-center gap-2 text-sm font-semibold">
            <input type="radio" name="decision" value={choice} checked={decision === choice} onChange={() => setDecision(choice)} className="accent-copper" />
            {labels[choice]}
          </label>
        ))}
      </fieldset>
      {decision === "publish" ? (
        <>
          <p className="text-sm text-ink-soft">Freezes the text and every cited figure as they are now; readers see it at once.</p>
          <ActionForm
            action={publishReport}
            schema={publishReportSchema}
            hidden={{ reportId }}
            submitLabel={isRevision ? "Approve and publish the revision" : "Approve and publish"}
            fields={(errors, values) => <TextAreaField label="Notes for the reviewer (optional)" name="notes" rows={2} errors={errors} values={values} />}
          />
        </>
      ) : decision === "schedule" ? (
        <>
          <p className="text-sm text-ink-soft">Approved and frozen now; it goes live within a minute of the chosen time.</p>
          <ActionForm
            action={scheduleReport}
            schema={scheduleReportSchema}
            hidden={{ reportId }}
            submitLabel="Approve and schedule"
            fields={(errors, values) => (
              <>
                <TextField label="Publish at (UTC)" name="publishAt" type="datetime-local" errors={errors} values={values} />
                <TextAreaField label="Notes for the reviewer (optional)" name="notes" rows={2} errors={errors} values={values} />
              </>
            )}
          />
        </>
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            {isRevision ? "The published version stays as it is; the reviewer gets your notes." : "The reviewer gets the report back with your notes to change it."}
          </p>
          <ActionForm
            action={sendBackReport}
            schema={sendBackSchema}
            hidden={{ reportId }}
            submitLabel={isRevision ? "Decline with notes" : "Send back with notes"}
            fields={(errors, values) => <TextAreaField label="What to change" name="notes" rows={4} errors={errors} values={values} />}
          />
        </>
      )}
    </section>
  );
}

export function RetractForm({ reportId }: { reportId: string }) {
  return (
    <section aria-labelledby="retract-heading" className={panel}>
      <h3 id="retract-heading" className="font-serif text-xl">
        Retract
      </h3>
      <p className="text-sm text-ink-soft">
        For a report whose findings cannot stand. It stays readable with the reason at the top; a correction is the way to fix a figure.
      </p>
      <ActionForm
        action={retractReport}
        schema={retractReportSchema}
        hidden={{ reportId }}
        submitLabel="Retract the report"
        fields={(errors, values) => <TextAreaField label="Reason (shown to readers)" name="reason" rows={3} errors={errors} values={values} />}
      />
    </section>
  );
}

export function MakerReplyForm({ reportId }: { reportId: string }) {
  return (
    <section aria-labelledby="maker-reply-form-heading" className={panel}>
      <h3 id="maker-reply-form-heading" className="font-serif text-xl">
        Attach the maker&apos;s reply
      </h3>
      <ActionForm
        action={attachMakerReply}
        schema={makerReplySchema}
        hidden={{ reportId }}
        submitLabel="Attach the reply"
        fields={(errors, values) => (
          <>
            <TextField label="Maker" name="makerName" errors={errors} values={values} />
            <TextField label="Received on" name="receivedOn" type="date" errors={errors} values={values} />
            <TextAreaField label="Their reply, as received (plain text)" name="body" rows={5} errors={errors} values={values} />
          </>
        )}
      />
    </section>
  );
}
