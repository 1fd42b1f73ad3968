// Reviewer MDX to a sanitised hast tree, without ever running code: the tree is parsed (JSX and expressions
// included, so errors carry a line and column), every expression, import and export is removed, and a final
// pass keeps only the elements, attributes and components in ./policy. The tree is plain JSON, so the server
// can hand it to the browser for the live preview and render it itself for the saved report: one pipeline.

import type { Element, ElementContent, Properties, Root, RootContent } from "hast";
import type { Root as MdastRoot, RootContent as MdastContent } from "mdast";
import type { MdxJsxAttribute, MdxJsxFlowElementHast, MdxJsxTextElementHast } from "mdast-util-mdx-jsx";
import remarkMdx from "remark-mdx";
import remarkParse from "remark-parse";
import remarkRehype from "remark-rehype";
import { unified } from "unified";
import type { Point, Position } from "unist";
import {
  allowedElements,
  CODE_LANGUAGE_CLASS,
  embedComponentSpecs,
  isEmbedName,
  isSafeUrl,
  jsxAttributeToProperty,
  MAX_MDX_LENGTH,
  PROBLEM_NOTE_COMPONENT,
  type EmbedName,
} from "./policy";

export type MdxProblem = { message: string; line: number | null; column: number | null };

/** One use of our components, so callers can check its labels against what the report cites. */
export type EmbedReference = { component: EmbedName; attributes: Record<string, string>; line: number | null; column: number | null };

export type CompiledMdx = {
  /** Null when the source does not parse; the problems then say where. */
  tree: Root | null;
  problems: MdxProblem[];
  references: EmbedReference[];
};

type JsxHast = MdxJsxFlowElementHast | MdxJsxTextElementHast;

const processor = unified()
  .use(remarkParse)
  .use(remarkMdx)
  .use(remarkRehype, { passThrough: ["mdxJsxFlowElement", "mdxJsxTextElement"] });

export function compileSafeMdx(source: string): CompiledMdx {
  if (source.length > MAX_MDX_LENGTH) {
    return { tree: null, problems: [{ message: `The text is longer than ${MAX_MDX_LENGTH} characters.`, line: null, column: null }], references: [] };
  }
  let mdast: MdastRoot;
  try {
    mdast = processor.parse(source);
  } catch (error) {
    if (!isParseMessage(error)) throw error;
    return { tree: null, problems: [{ message: error.reason, line: error.line ?? null, column: error.column ?? null }], references: [] };
  }
  const problems: MdxProblem[] = [];
  removeScript(mdast, problems);
  const hast = processor.runSync(mdast) as Root;
  const references: EmbedReference[] = [];
  const tree: Root = { type: "root", children: sanitizeChildren(hast.children, problems, references) as RootContent[] };
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
  return { tree, problems, references };
}

/** Problems with the labels a body uses: what it names must be cited (analyses), uploaded (images) or covered (tools). */
export function checkEmbedReferences(
  references: readonly EmbedReference[],
  known: { analysisLabels: readonly string[]; imageNames: readonly string[]; toolSlugs: readonly string[] },
): MdxProblem[] {
  const problems: MdxProblem[] = [];
  for (const { component, attributes, line, column } of references) {
    const at = { line, column };
    if (attributes.analysis !== undefined && !known.analysisLabels.includes(attributes.analysis)) {
      problems.push({ message: `<${component}> names analysis "${attributes.analysis}", which this report does not cite.`, ...at });
    }
    if (attributes.image !== undefined && !known.imageNames.includes(attributes.image)) {
      problems.push({ message: `<${component}> names image "${attributes.image}", which is not uploaded to this report.`, ...at });
    }
    if (attributes.tool !== undefined && !known.toolSlugs.includes(attributes.tool)) {
      problems.push({ message: `<${component}> names tool "${attributes.tool}", which this report does not cover.`, ...at });
    }
  }
  return problems;
}

/** The parser reports where the source stops making sense as a vfile message. */
function isParseMessage(error: unknown): error is { reason: string; line?: number; column?: number } {
  return error instanceof Error && typeof (error as { reason?: unknown }).reason === "string";
}

function startOf(position: Position | undefined): { line: number | null; column: number | null } {
  const start: Point | undefined = position?.start;
  return { line: start?.line ?? null, column: start?.column ?? null };
}

/** A comment is written {/* … *\/} in MDX; dropping it silently is what the writer meant. */
function isCommentOnly(value: string): boolean {
  return /^\s*\/\*[\s\S]*\*\/\s*$/.test(value);
}

// Expressions and ESM never reach the hast stage: turned into hast they would show their source as text, and
// nothing downstream may ever evaluate them.
function removeScript(parent: { children: MdastContent[] }, problems: MdxProblem[]): void {
  parent.children = parent.children.filter((node) => {
    if (node.type === "mdxjsEsm") {
      problems.push({ message: "import and export statements are not allowed in reports; they were removed.", ...startOf(node.position) });
      return false;
    }
    if (node.type === "mdxFlowExpression" || node.type === "mdxTextExpression") {
      if (!isCommentOnly(node.value)) {
        problems.push({
          message: "Expressions in braces are not allowed in reports; it was removed. Write \\{ for a literal brace.",
          ...startOf(node.position),
        });
      }
      return false;
    }
    if (node.type === "mdxJsxFlowElement" || node.type === "mdxJsxTextElement") {
      node.attributes = node.attributes.filter((attribute) => {
        const literal = attribute.type === "mdxJsxAttribute" && (attribute.value === null || typeof attribute.value === "string");
        if (!literal) {
          problems.push({
            message: `<${node.name ?? ""}>: attribute values must be plain text in quotes, not expressions; ${
              attribute.type === "mdxJsxAttribute" ? `"${attribute.name}"` : "a spread"
            } was removed.`,
            ...startOf(attribute.position ?? node.position),
          });
        }
        return literal;
      });
    }
    if ("children" in node) removeScript(node as { children: MdastContent[] }, problems);
    return true;
  });
}

// Our components travel as elements named after them: the JSX runtime looks an element's name up in the
// components it is given, while a JSX node's capitalised name would need code evaluated to resolve.
function problemNote(kind: "block" | "inline", message: string, position: Position | undefined, problems: MdxProblem[]): Element {
  const at = startOf(position);
  problems.push({ message, ...at });
  const where = at.line === null ? "" : ` (line ${at.line})`;
  return {
    type: "element",
    tagName: PROBLEM_NOTE_COMPONENT,
    properties: { message: `${message}${where}`, ...(kind === "inline" ? { inline: true } : {}) },
    children: [],
  };
}

function sanitizeChildren(children: readonly (RootContent | ElementContent)[], problems: MdxProblem[], references: EmbedReference[]) {
  const kept: ElementContent[] = [];
  for (const child of children) {
    const clean = sanitizeNode(child, problems, references);
    if (clean) kept.push(clean);
  }
  return kept;
}

function sanitizeNode(node: RootContent | ElementContent, problems: MdxProblem[], references: EmbedReference[]): ElementContent | null {
  switch (node.type) {
    case "text":
      return { type: "text", value: node.value };
    case "element":
      return sanitizeElement(node, problems, references);
    case "mdxJsxFlowElement":
    case "mdxJsxTextElement":
      return sanitizeJsx(node, problems, references);
    default:
      // Comments, doctypes, raw HTML and anything unforeseen: nothing of it reaches the page.
      return null;
  }
}

function sanitizeElement(node: Element, problems: MdxProblem[], references: EmbedReference[]): ElementContent {
  const kind = isBlockTag(node.tagName) ? "block" : "inline";
  if (node.tagName === "img") {
    return problemNote(kind, "Markdown images are not allowed; upload the picture and use <Figure image=\"…\" />.", node.position, problems);
  }
  const allowed = allowedElements[node.tagName];
  if (!allowed) return problemNote(kind, `<${node.tagName}> is not allowed in reports and was removed.`, node.position, problems);
  const properties: Properties = {};
  for (const [name, value] of Object.entries(node.properties)) {
    if (!allowed.includes(name)) continue;
    if (name === "href") {
      if (typeof value !== "string" || !isSafeUrl(value)) {
        problems.push({ message: `A link to "${String(value)}" was removed: links may be relative or use http, https or mailto.`, ...startOf(node.position) });
        continue;
      }
    }
    if (name === "className") {
      const classes = (Array.isArray(value) ? value : [value]).filter((item): item is string => typeof item === "string" && CODE_LANGUAGE_CLASS.test(item));
      if (classes.length) properties.className = classes;
      continue;
    }
    properties[name] = value;
  }
  return { type: "element", tagName: node.tagName, properties, children: sanitizeChildren(node.children, problems, references) };
}

function sanitizeJsx(node: JsxHast, problems: MdxProblem[], references: EmbedReference[]): ElementContent | null {
  const kind = node.type === "mdxJsxFlowElement" ? "block" : "inline";
  const { name } = node;
  // A fragment (<>…</>) only groups; keep what is inside it.
  if (name === null) {
    return { type: "element", tagName: kind === "block" ? "div" : "span", properties: {}, children: sanitizeChildren(node.children, problems, references) };
  }
  const attributes = node.attributes.filter((attribute): attribute is MdxJsxAttribute => attribute.type === "mdxJsxAttribute");
  if (isEmbedName(name)) return sanitizeEmbed(node, name, attributes, problems, references);
  const allowed = allowedElements[name];
  if (!allowed) {
    return problemNote(kind, `<${name}> is not allowed in reports and was removed.`, node.position, problems);
  }
  const element: Element = {
    type: "element",
    tagName: name,
    properties: {},
    position: node.position,
    children: node.children as ElementContent[],
  };
  for (const attribute of attributes) {
    const property = jsxAttributeToProperty[attribute.name];
    if (!property || !allowed.includes(property)) {
      problems.push({ message: `<${name}>: the attribute "${attribute.name}" is not allowed and was removed.`, ...startOf(attribute.position ?? node.position) });
      continue;
    }
    element.properties[property] = typeof attribute.value === "string" ? attribute.value : true;
  }
  return sanitizeElement(element, problems, references);
}

function sanitizeEmbed(
  node: JsxHast,
  name: EmbedName,
  attributes: MdxJsxAttribute[],
  problems: MdxProblem[],
  references: EmbedReference[],
): Element {
  const spec: { required: readonly string[]; optional: readonly string[] } = embedComponentSpecs[name];
  const values: Record<string, string> = {};
  for (const attribute of attributes) {
    if (!spec.required.includes(attribute.name) && !spec.optional.includes(attribute.name)) {
      problems.push({ message: `<${name}>: the attribute "${attribute.name}" is not one it takes and was removed.`, ...startOf(attribute.position ?? node.position) });
      continue;
    }
    if (typeof attribute.value !== "string") {
      problems.push({ message: `<${name}>: "${attribute.name}" needs a value in quotes.`, ...startOf(attribute.position ?? node.position) });
      continue;
    }
    values[attribute.name] = attribute.value.slice(0, 300);
  }
  const kind = node.type === "mdxJsxFlowElement" ? "block" : "inline";
  const missing = spec.required.filter((attribute) => values[attribute] === undefined);
  if (missing.length) {
    return problemNote(kind, `<${name}> needs ${missing.map((attribute) => `${attribute}="…"`).join(" and ")}.`, node.position, problems);
  }
  references.push({ component: name, attributes: values, ...startOf(node.position) });
  // Our components take no children; whatever was written inside is dropped rather than trusted.
  return { type: "element", tagName: name, properties: values, children: [] };
}

const blockTags = new Set(["blockquote", "details", "div", "dl", "h1", "h2", "h3", "h4", "h5", "h6", "hr", "ol", "p", "pre", "table", "ul"]);

function isBlockTag(tagName: string): boolean {
  return blockTags.has(tagName);
}
