import { SelectField } from "@/components/ui/form-controls";
import { decisionRuleLabels, decisionRules } from "@/lib/validations/runs";

/** How a verdict treats the uncertainty at the tolerance limits (ILAC-G8): asked wherever a rating is judged. */
export function DecisionRuleSelect({ errors, defaultValue }: { errors: Record<string, string[] | undefined> | undefined; defaultValue: string | undefined }) {
  return (
    <SelectField label="Decision rule" name="rule" errors={errors} defaultValue={defaultValue ?? "simple"}>
      {decisionRules.map((rule) => (
        <option key={rule} value={rule}>
          {decisionRuleLabels[rule]}
        </option>
      ))}
    </SelectField>
  );
}
