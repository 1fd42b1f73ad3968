// What reviewer MDX may contain. Everything not listed here is removed before anything renders: MDX passes raw
// elements such as <script> and any attribute (onerror, style) straight through, so the list is an allowlist.

/** Our own components, with the attributes each accepts (always plain strings, never expressions). */
export const embedComponentSpecs = {
  VerdictTable: {
    required: ["analysis"],
    optional: [],
    usage: '<VerdictTable analysis="label" />',
    purpose: "each rating judged: rated, measured ± U, tolerance and acceptance limits, decision rule, verdict",
  },
  WaveformChart: {
    required: ["analysis"],
    optional: [],
    usage: '<WaveformChart analysis="label" />',
    purpose: "current and voltage against time, downsampled",
  },
  ConductionMap: {
    required: ["analysis"],
    optional: [],
    usage: '<ConductionMap analysis="label" />',
    purpose: "which half-cycles conduct and which are blocked",
  },
  HarmonicChart: {
    required: ["analysis"],
    optional: [],
    usage: '<HarmonicChart analysis="label" />',
    purpose: "harmonic currents against the IEC 61000-3-2 limits",
  },
  HeatUpCurve: {
    required: ["analysis"],
    optional: [],
    usage: '<HeatUpCurve analysis="label" />',
    purpose: "temperature against time with the setpoint band",
  },
  SpecTable: {
    required: [],
    optional: ["tool"],
    usage: '<SpecTable tool="tool-slug" />',
    purpose: "the maker's ratings beside what the cited runs measured (tool defaults to the report's first)",
  },
  Figure: {
    required: ["image"],
    optional: ["caption"],
    usage: '<Figure image="image-name" caption="What it shows" />',
    purpose: "an uploaded photo or scope screenshot, with its alt text",
  },
  SafetyNotice: {
    required: [],
    optional: [],
    usage: "<SafetyNotice />",
    purpose: "the standard caution for mains and hot-air work",
  },
} as const satisfies Record<string, { required: readonly string[]; optional: readonly string[]; usage: string; purpose: string }>;

export type EmbedName = keyof typeof embedComponentSpecs;

export function isEmbedName(name: string): name is EmbedName {
  return Object.hasOwn(embedComponentSpecs, name);
}

/** Inserted by the sanitiser in place of whatever it removed; writers cannot produce it themselves. */
export const PROBLEM_NOTE_COMPONENT = "MdxProblemNote";

/**
 * HTML elements allowed in the output, with the hast property names each may carry. Markdown produces most of
 * them; writers may also type the ones that Markdown has no syntax for (sup, sub, abbr, kbd, details…) as JSX.
 * No id (DOM clobbering), no class (our own utility classes could overlay the page), no style, no on* handlers.
 */
export const allowedElements: Readonly<Record<string, readonly string[]>> = {
  a: ["href", "title"],
  abbr: ["title"],
  blockquote: [],
  br: [],
  caption: [],
  cite: [],
  code: ["className"],
  dd: [],
  del: [],
  details: [],
  dl: [],
  dt: [],
  em: [],
  h1: [],
  h2: [],
  h3: [],
  h4: [],
  h5: [],
  h6: [],
  hr: [],
  kbd: [],
  li: [],
  ol: ["start"],
  p: [],
  pre: [],
  q: [],
  s: [],
  small: [],
  strong: [],
  sub: [],
  summary: [],
  sup: [],
  table: [],
  tbody: [],
  td: ["colSpan", "rowSpan"],
  th: ["colSpan", "rowSpan", "scope"],
  thead: [],
  tr: [],
  ul: [],
};

/** JSX spells attributes as HTML does or as React does; hast wants the property name. */
export const jsxAttributeToProperty: Readonly<Record<string, string>> = {
  href: "href",
  title: "title",
  start: "start",
  scope: "scope",
  colspan: "colSpan",
  colSpan: "colSpan",
  rowspan: "rowSpan",
  rowSpan: "rowSpan",
};

/** A fenced code block's language becomes `language-xyz`; no other class survives. */
export const CODE_LANGUAGE_CLASS = /^language-[A-Za-z0-9_+#-]{1,40}$/;

const SAFE_SCHEMES = new Set(["http", "https", "mailto"]);

/**
 * Links may be relative or use http, https or mailto. Browsers ignore control characters and spaces inside a
 * scheme ("java\tscript:"), so those are dropped before the scheme is read; entities are already decoded by the
 * parser, so "javascript&colon;" arrives here as "javascript:".
 */
export function isSafeUrl(value: string): boolean {
  const compact = value.replace(/[\u0000-\u0020\u007f-\u009f]/g, "");
  const scheme = /^([^/?#:]*):/.exec(compact)?.[1];
  if (scheme === undefined) return true;
  return SAFE_SCHEMES.has(scheme.toLowerCase());
}

/** Labels name a cited analysis or an uploaded image inside the MDX body. */
export const referenceNamePattern = /^[a-z0-9][a-z0-9-]{0,47}$/;

/** A report body far longer than any report, so a paste accident cannot tie up the compiler. */
export const MAX_MDX_LENGTH = 100_000;
