// Search snippets come from PostgreSQL's ts_headline, which wraps each matched word in markers of our choosing and
// returns the reviewer's text otherwise untouched. The markers are two private-use characters that the indexed text
// never contains (the search text strips them), so splitting on them is unambiguous, and the page renders each piece
// as text: whatever the report says, it never becomes markup.

export const matchStart = "\uE000";
export const matchEnd = "\uE001";

export type SnippetPart = { text: string; matched: boolean };

/** The snippet as plain and matched runs, in order; a marker left unclosed ends at the end of the text. */
export function splitSnippet(snippet: string): SnippetPart[] {
  const parts: SnippetPart[] = [];
  let matched = false;
  let current = "";
  const flush = () => {
    if (current) parts.push({ text: current, matched });
    current = "";
  };
  for (const character of snippet) {
    if (character === matchStart || character === matchEnd) {
      flush();
      matched = character === matchStart;
    } else {
      current += character;
    }
  }
  flush();
  return parts;
}
