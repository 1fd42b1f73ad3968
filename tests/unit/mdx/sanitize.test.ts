import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { checkEmbedReferences, compileSafeMdx } from "@/lib/mdx/compile";
import { embedComponentSpecs, isSafeUrl } from "@/lib/mdx/policy";
import { renderSafeTree, type EmbedComponents } from "@/lib/mdx/render-tree";

const stubEmbeds = Object.fromEntries(
  Object.keys(embedComponentSpecs).map((name) => [name, (props: Record<string, string>) =>
    `[${name} ${Object.entries(props).map(([key, value]) => `${key}=${value}`).join(" ")}]`]),
) as EmbedComponents;

function html(source: string): string {
  const { tree } = compileSafeMdx(source);
  if (!tree) throw new Error("did not compile");
  return renderToStaticMarkup(renderSafeTree(tree, stubEmbeds));
}

describe("safe MDX: what must never reach the page", () => {
  it("removes <script> elements and their content, with a visible note and a problem at the line", () => {
    const source = "Intro\n\n<script>window.pwned = true</script>\n\n<script src=\"https://evil.example/x.js\" />";
    const { problems } = compileSafeMdx(source);
    const output = html(source);
    expect(output).not.toMatch(/<script/i);
    expect(output).not.toContain("pwned");
    expect(output).toContain("&lt;script&gt; is not allowed in reports and was removed. (line 3)");
    expect(problems.map((problem) => problem.line)).toEqual([3, 5]);
  });

  it("strips event handlers and style from allowed elements and refuses unknown ones", () => {
    const source = [
      '<img src="x" onError="window.pwned = true" />',
      "",
      'Text with <sup onClick="window.pwned = true" style="position:fixed">2</sup> and <kbd onmouseover="x">Ctrl</kbd>.',
      "",
      '<details open onToggle="window.pwned = true"><summary>More</summary>Hidden text</details>',
    ].join("\n");
    const output = html(source);
    expect(output).not.toMatch(/\son\w+=/i);
    expect(output).not.toContain("style=");
    expect(output).not.toMatch(/<img/i);
    expect(output).toContain("<sup>2</sup>");
    expect(output).toContain("<kbd>Ctrl</kbd>");
    const { problems } = compileSafeMdx(source);
    expect(problems.map((problem) => problem.message).join("\n")).toMatch(/"onClick" is not allowed[\s\S]*"style" is not allowed/);
  });

  it("drops javascript: and data: URLs however they are spelled, keeping the link text", () => {
    const payloads = [
      "[a](javascript:alert(1))",
      "[b](JaVaScRiPt:alert(1))",
      '<a href="java&#x09;script:alert(1)">c</a>',
      '<a href="&#106;avascript:alert(1)">d</a>',
      '<a href=" javascript:alert(1)">e</a>',
      "[f](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)",
      "[g][ref]\n\n[ref]: vbscript:msgbox(1)",
    ];
    for (const payload of payloads) {
      const output = html(payload);
      expect(output, payload).not.toMatch(/href="\s*(javascript|data|vbscript)/i);
      expect(output, payload).not.toMatch(/href="[^"]*script/i);
      expect(compileSafeMdx(payload).problems.length, payload).toBeGreaterThan(0);
    }
    expect(html("[ok](https://example.org/a?b=c) and [rel](/tools) and [mail](mailto:desk@benchplate.test)")).toContain(
      'href="https://example.org/a?b=c"',
    );
  });

  it("never evaluates expressions, imports or exports, and says where they were", () => {
    const source = 'import fs from "node:fs"\n\nexport const x = 1\n\nValue {process.exit(1)} here.\n\n{/* a writer\'s comment */}\n\n<VerdictTable analysis={label} />';
    const { problems } = compileSafeMdx(source);
    const output = html(source);
    expect(output).not.toContain("process");
    expect(output).not.toContain("node:fs");
    expect(output).not.toContain("comment");
    expect(problems.map((problem) => [problem.line, problem.message.slice(0, 20)])).toEqual([
      [1, "import and export st"],
      [3, "import and export st"],
      [5, "Expressions in brace"],
      [9, "<VerdictTable> needs"],
      [9, "<VerdictTable>: attr"],
    ]);
  });

  it("turns unknown elements and components into harmless notes", () => {
    const source = '<iframe src="https://evil.example" />\n\n<Marquee>scrolling</Marquee>\n\n<object data="x.swf" />\n\n<form action="/x"><input name="q" /></form>\n\nText <Blink>now</Blink>.';
    const output = html(source);
    for (const tag of ["iframe", "marquee", "object", "form", "input", "blink"]) expect(output).not.toMatch(new RegExp(`<${tag}`, "i"));
    expect(output).toContain('<span role="note"');
    expect(output.match(/role="note"/g)).toHaveLength(5);
    expect(output).not.toContain("scrolling");
  });

  it("keeps no class, id or style a writer types, only a code block's language", () => {
    const output = html('<p className="fixed inset-0" id="main" style="color:red">x</p>\n\n```js extra words\nlet a = 1;\n```');
    expect(output).not.toContain("fixed");
    expect(output).not.toContain('id="main"');
    expect(output).toContain('<code class="language-js">');
  });

  it("passes our components through with only their own string attributes", () => {
    const source = '<VerdictTable analysis="aeris-full-power" onClick="x" />\n\n<Figure image="bench-setup" caption="The bench" />';
    const output = html(source);
    expect(output).toContain("[VerdictTable analysis=aeris-full-power]");
    expect(output).toContain("[Figure image=bench-setup caption=The bench]");
    const { references } = compileSafeMdx(source);
    expect(checkEmbedReferences(references, { analysisLabels: [], imageNames: ["bench-setup"], toolSlugs: [] })).toEqual([
      { message: '<VerdictTable> names analysis "aeris-full-power", which this report does not cite.', line: 1, column: 1 },
    ]);
  });

  it("reports a syntax error with its line and column instead of a tree", () => {
    const compiled = compileSafeMdx("# Heading\n\nA broken <b tag");
    expect(compiled.tree).toBeNull();
    expect(compiled.problems[0]).toMatchObject({ line: 3, column: expect.any(Number) });
  });

  it("links: relative and http(s)/mailto only", () => {
    expect(isSafeUrl("/tools/x")).toBe(true);
    expect(isSafeUrl("#section")).toBe(true);
    expect(isSafeUrl("https://a.example")).toBe(true);
    expect(isSafeUrl("java\nscript:alert(1)")).toBe(false);
    expect(isSafeUrl("\u0001javascript:alert(1)")).toBe(false);
    expect(isSafeUrl("data:text/html,x")).toBe(false);
  });
});

describe("renderSafeMdx", () => {
  it("renders Markdown, notes our components outside a report, and shows a syntax error with its place", async () => {
    const { renderSafeMdx } = await import("@/lib/mdx/render");
    const rendered = renderToStaticMarkup(renderSafeMdx("## Steps\n\n1. Warm up\n\n<HeatUpCurve analysis=\"x\" />").content);
    expect(rendered).toContain("<h2>Steps</h2>");
    expect(rendered).toContain("works only inside a report");
    const broken = renderSafeMdx("Line one\n\n<b>unclosed");
    expect(broken.problems[0]?.line).toBe(3);
    expect(renderToStaticMarkup(broken.content)).toMatch(/could not be read at line 3, column \d+/);
  });
});
