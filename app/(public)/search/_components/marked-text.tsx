import { splitSnippet } from "@/lib/search-snippet";

/** Text from ts_headline with the matched words as <mark>: every piece is rendered as text, never as markup. */
export function MarkedText({ text }: { text: string }) {
  return (
    <>
      {splitSnippet(text).map((part, index) =>
        // The parts are a fixed sequence cut from one string; their position is their identity.
        part.matched ? (
          <mark key={index} className="rounded-sm bg-copper-wash px-0.5 text-ink">
            {part.text}
          </mark>
        ) : (
          <span key={index}>{part.text}</span>
        ),
      )}
    </>
  );
}
