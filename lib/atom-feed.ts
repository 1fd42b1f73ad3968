// An Atom 1.0 document (RFC 4287) written as text. Pure: the route handler feeds it what the database says.

export type AtomEntry = {
  /** A permanent IRI: the same event keeps the same id on every fetch. */
  id: string;
  title: string;
  /** ISO 8601 */
  updated: string;
  published?: string;
  authorName: string;
  link: string;
  category: { term: string; label: string };
  summary: string;
};

export type AtomFeed = {
  id: string;
  title: string;
  subtitle: string;
  selfLink: string;
  alternateLink: string;
  authorName: string;
  rights: string;
  entries: AtomEntry[];
};

// XML 1.0 forbids most control characters even as references, and text from forms can carry them.
const forbiddenInXml = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g;

export function escapeXml(text: string): string {
  return text
    .replace(forbiddenInXml, "")
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&apos;");
}

function element(name: string, text: string, indent: string): string {
  return `${indent}<${name}>${escapeXml(text)}</${name}>`;
}

function entryXml(entry: AtomEntry): string {
  const indent = "    ";
  return [
    "  <entry>",
    element("id", entry.id, indent),
    element("title", entry.title, indent),
    element("updated", entry.updated, indent),
    ...(entry.published ? [element("published", entry.published, indent)] : []),
    `${indent}<author><name>${escapeXml(entry.authorName)}</name></author>`,
    `${indent}<link rel="alternate" type="text/html" href="${escapeXml(entry.link)}"/>`,
    `${indent}<category term="${escapeXml(entry.category.term)}" label="${escapeXml(entry.category.label)}"/>`,
    `${indent}<summary type="text">${escapeXml(entry.summary)}</summary>`,
    "  </entry>",
  ].join("\n");
}

/** The feed's `updated` is its newest entry's, so an unchanged feed reads the same on every fetch. */
export function renderAtomFeed(feed: AtomFeed): string {
  const updated = feed.entries.reduce((latest, entry) => (entry.updated > latest ? entry.updated : latest), new Date(0).toISOString());
  const indent = "  ";
  return [
    '<?xml version="1.0" encoding="utf-8"?>',
    '<feed xmlns="http://www.w3.org/2005/Atom">',
    element("id", feed.id, indent),
    element("title", feed.title, indent),
    element("subtitle", feed.subtitle, indent),
    element("updated", updated, indent),
    `${indent}<link rel="self" type="application/atom+xml" href="${escapeXml(feed.selfLink)}"/>`,
    `${indent}<link rel="alternate" type="text/html" href="${escapeXml(feed.alternateLink)}"/>`,
    `${indent}<author><name>${escapeXml(feed.authorName)}</name></author>`,
    element("rights", feed.rights, indent),
    ...feed.entries.map(entryXml),
    "</feed>",
    "",
  ].join("\n");
}
