import type { ReactNode } from "react";

// Readers' words are shown as text, never as markup: React escapes every character, line breaks are kept by CSS, and
// web addresses become links that search engines do not credit.

const webAddress = /\bhttps?:\/\/[^\s<>"]+/g;
// A sentence's closing punctuation is not part of the address it ends with.
const trailingPunctuation = /[.,;:!?)\]'"]+$/;

function linkify(text: string): ReactNode[] {
  const parts: ReactNode[] = [];
  let last = 0;
  for (const match of text.matchAll(webAddress)) {
    const address = match[0].replace(trailingPunctuation, "");
    const start = match.index;
    parts.push(text.slice(last, start));
    parts.push(
      <a key={start} href={address} rel="nofollow ugc noopener" className="break-all text-copper underline">
        {address}
      </a>,
    );
    last = start + address.length;
  }
  parts.push(text.slice(last));
  return parts;
}

export function CommentText({ body }: { body: string }) {
  return <p className="whitespace-pre-line break-words">{linkify(body)}</p>;
}
