/** Stands where the sanitiser removed something from reviewer MDX, so the writer sees what went and why. */
export function MdxProblemNote({ message, inline }: { message: string; inline?: boolean }) {
  const Tag = inline ? "span" : "p";
  return (
    <Tag role="note" className="not-prose my-2 inline-block rounded border border-dashed border-copper bg-copper-wash px-2 py-1 font-sans text-sm text-copper-deep">
      {message}
    </Tag>
  );
}
