/** A GET form with one select, for lists filtered and paged on the server; a refused value's reason shows beside it. */
export function SelectFilter({
  name,
  label,
  value,
  options,
  submitLabel = "Filter",
  problem,
}: {
  name: string;
  label: string;
  value: string;
  options: { value: string; label: string }[];
  submitLabel?: string;
  problem?: string | null;
}) {
  return (
    <form className="flex flex-wrap items-end gap-3" role="search">
      <div className="flex flex-col gap-1">
        <label htmlFor={`filter-${name}`} className="text-sm font-semibold">
          {label}
        </label>
        <select id={`filter-${name}`} name={name} defaultValue={value} className="rounded border border-rule bg-paper-raised px-3 py-2">
          {options.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised">
        {submitLabel}
      </button>
      {problem ? <p className="text-sm text-copper-deep">{problem}</p> : null}
    </form>
  );
}
