import type { RevisionKind } from "@/db/schema";
import type { AtomEntry } from "@/lib/atom-feed";
import { revisionKindLabels } from "@/lib/validations/editorial";
import { countVerdicts, describeVerdicts } from "@/lib/verdict-summary";

// What the Atom feed says about each published revision and each retraction. Pure, so the wording is tested
// without a database; lib/reader-lists.ts loads the events.

export const reportFeedTitle = "Benchplate: bench reports";

export type RevisionEvent = {
  slug: string;
  number: number;
  kind: RevisionKind;
  changeNote: string;
  publishedAt: Date;
  title: string;
  authorName: string;
  toolNames: string[];
  verdictResults: unknown[];
};

export type RetractionEvent = { slug: string; retractedAt: Date; reason: string; title: string; authorName: string };

/** A revision's permanent address, which is also its entry id: revision pages never change once published. */
export function revisionUrl(origin: string, slug: string, number: number): string {
  return `${origin}/reports/${slug}/revisions/${number}`;
}

/** Notes are typed by people: a note without a full stop must not run into the sentence after it. */
function asSentence(text: string): string {
  const trimmed = text.trim();
  return /[.!?…]["”’)]*$/.test(trimmed) ? trimmed : `${trimmed}.`;
}

function revisionEntry(origin: string, event: RevisionEvent): AtomEntry {
  const at = event.publishedAt.toISOString();
  const tools = event.toolNames.join(" vs ");
  const verdicts = `Verdicts: ${describeVerdicts(countVerdicts(event.verdictResults))}.`;
  const original = event.kind === "original";
  return {
    id: revisionUrl(origin, event.slug, event.number),
    title: original ? event.title : `${revisionKindLabels[event.kind]} to “${event.title}” (revision ${event.number})`,
    updated: at,
    published: at,
    authorName: event.authorName,
    link: original ? `${origin}/reports/${event.slug}` : revisionUrl(origin, event.slug, event.number),
    category: { term: event.kind === "original" ? "publication" : event.kind, label: original ? "New report" : revisionKindLabels[event.kind] },
    summary: original ? `New report on ${tools}. ${verdicts}` : `${asSentence(event.changeNote)} ${verdicts}`,
  };
}

function retractionEntry(origin: string, event: RetractionEvent): AtomEntry {
  const at = event.retractedAt.toISOString();
  return {
    id: `${origin}/reports/${event.slug}#retraction`,
    title: `Retracted: “${event.title}”`,
    updated: at,
    published: at,
    authorName: event.authorName,
    link: `${origin}/reports/${event.slug}`,
    category: { term: "retraction", label: "Retraction" },
    summary: `${asSentence(event.reason)} The report stays readable under a retraction notice; its results no longer stand.`,
  };
}

/** Revisions and retractions as one stream, newest first, at most `limit` of them. */
export function reportFeedEntries({
  origin,
  revisions,
  retractions,
  limit,
}: {
  origin: string;
  revisions: readonly RevisionEvent[];
  retractions: readonly RetractionEvent[];
  limit: number;
}): AtomEntry[] {
  return [...revisions.map((event) => revisionEntry(origin, event)), ...retractions.map((event) => retractionEntry(origin, event))]
    .sort((a, b) => b.updated.localeCompare(a.updated) || a.id.localeCompare(b.id))
    .slice(0, limit);
}
