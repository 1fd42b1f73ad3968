import { SelectField } from "@/components/ui/form-controls";

type FieldErrors = Record<string, string[] | undefined> | undefined;

/** One tool, or a second for a head-to-head. */
export function ToolFields({
  tools,
  errors,
  toolId,
  secondToolId,
}: {
  tools: { id: string; name: string }[];
  errors: FieldErrors;
  toolId?: string;
  secondToolId?: string;
}) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <SelectField label="Tool" name="toolId" errors={errors} defaultValue={toolId ?? ""} key={`tool-${toolId}`}>
        <option value="">Choose a tool…</option>
        {tools.map((tool) => (
          <option key={tool.id} value={tool.id}>
            {tool.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Second tool (head-to-head, optional)" name="secondToolId" errors={errors} defaultValue={secondToolId ?? ""} key={`second-${secondToolId}`}>
        <option value="">None: a single-tool report</option>
        {tools.map((tool) => (
          <option key={tool.id} value={tool.id}>
            {tool.name}
          </option>
        ))}
      </SelectField>
    </div>
  );
}
