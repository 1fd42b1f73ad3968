import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { MarkedText } from "@/app/(public)/search/_components/marked-text";
import { matchEnd, matchStart, splitSnippet } from "@/lib/search-snippet";

const mark = (word: string) => `${matchStart}${word}${matchEnd}`;

describe("splitSnippet", () => {
  it("cuts a headline into plain and matched runs, in order", () => {
    expect(splitSnippet(`the ${mark("heater")} switches in whole ${mark("cycles")}`)).toEqual([
      { text: "the ", matched: false },
      { text: "heater", matched: true },
      { text: " switches in whole ", matched: false },
      { text: "cycles", matched: true },
    ]);
  });

  it("gives text without markers as one plain run, and nothing for nothing", () => {
    expect(splitSnippet("no match here")).toEqual([{ text: "no match here", matched: false }]);
    expect(splitSnippet("")).toEqual([]);
  });

  it("ends an unclosed mark at the end of the text", () => {
    expect(splitSnippet(`a ${matchStart}b`)).toEqual([
      { text: "a ", matched: false },
      { text: "b", matched: true },
    ]);
  });
});

describe("MarkedText", () => {
  it("renders matched words as <mark> and any markup in the text as text", () => {
    const html = renderToStaticMarkup(createElement(MarkedText, { text: `<script>alert(1)</script> ${mark("<b>hot</b>")} & more` }));
    expect(html).not.toContain("<script>");
    expect(html).not.toContain("<b>");
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(html).toMatch(/<mark[^>]*>&lt;b&gt;hot&lt;\/b&gt;<\/mark>/);
    expect(html).toContain("&amp; more");
  });
});
