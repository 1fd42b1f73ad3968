import { count, inArray, sql } from "drizzle-orm";
import type { Transaction } from "@/db";
import { auditLog, measurementRequests, notificationPreferences, reports, requestVotes, tools, users, type RequestStatus } from "@/db/schema";
import { declinedReason, demoEditorEmail, demoRequests, seededRequestIds } from "./community-data";
import { demoPeople } from "./people-and-catalogue-data";

const day = 24 * 3600_000;

// Audit entries double as each request's public history, so the seeded states come with theirs (fixed ids, idempotent).
const historyIds = {
  planned: "5eed0002-7e57-4b00-8000-000000000003",
  declined: "5eed0002-7e57-4b00-8000-000000000004",
  merged: "5eed0002-7e57-4b00-8000-000000000002",
  measured: "5eed0002-7e57-4b00-8000-000000000005",
};

/** Requests in every state, their votes and history, and e-mail settings for the demo people. Upserts by fixed id. */
export async function seedCommunity(tx: Transaction) {
  const people = await tx
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(inArray(users.email, demoPeople.map((person) => person.email)));
  const userId = new Map(people.map((person) => [person.email, person.id]));
  const toolRows = await tx.select({ id: tools.id, slug: tools.slug }).from(tools);
  const toolId = new Map(toolRows.map((tool) => [tool.slug, tool.id]));
  const editorId = userId.get(demoEditorEmail) ?? null;
  // A measured request links the report that answers it; only a submitted or published one may.
  const [answeringReport] = await tx
    .select({ id: reports.id })
    .from(reports)
    .where(inArray(reports.status, ["published", "submitted"]))
    .orderBy(sql`${reports.status} = 'published' desc`, reports.createdAt)
    .limit(1);

  const finalState: Record<string, { status: RequestStatus; declineReason: string | null; mergedIntoId: string | null; answeredByReportId: string | null }> = {
    [seededRequestIds.planned]: { status: "planned", declineReason: null, mergedIntoId: null, answeredByReportId: null },
    [seededRequestIds.declined]: { status: "declined", declineReason: declinedReason, mergedIntoId: null, answeredByReportId: null },
    [seededRequestIds.mergedDuplicate]: {
      status: "declined",
      declineReason: "Merged into the request for Marrowby Heatworks HX-2000 Torrent.",
      mergedIntoId: seededRequestIds.mostWanted,
      answeredByReportId: null,
    },
    [seededRequestIds.measured]: { status: "measured", declineReason: null, mergedIntoId: null, answeredByReportId: answeringReport?.id ?? null },
  };

  const seeded = demoRequests.filter((request) => request.id !== seededRequestIds.measured || answeringReport);
  // Targets first: the merged duplicate points at the most wanted request.
  for (const request of seeded) {
    const requesterId = userId.get(request.requesterEmail);
    if (!requesterId) throw new Error(`demo request ${request.id} names unknown person ${request.requesterEmail}`);
    const values = {
      toolId: request.toolSlug ? (toolId.get(request.toolSlug) ?? null) : null,
      proposedToolName: request.proposedToolName,
      whatToMeasure: request.whatToMeasure,
      why: request.why,
      requesterId,
      status: "open" as RequestStatus,
      declineReason: null,
      mergedIntoId: null,
      answeredByReportId: null,
      ...finalState[request.id],
      createdAt: new Date(Date.now() - request.daysAgo * day),
    };
    await tx.insert(measurementRequests).values({ id: request.id, ...values }).onConflictDoUpdate({ target: measurementRequests.id, set: values });
  }

  const seededIds = seeded.map((request) => request.id);
  await tx.delete(requestVotes).where(inArray(requestVotes.requestId, seededIds));
  for (const request of seeded) {
    // A merged request's votes live on its target.
    const votedRequestId = finalState[request.id]?.mergedIntoId ?? request.id;
    const voters = request.voterEmails.map((email) => userId.get(email)).filter((id): id is string => Boolean(id));
    if (voters.length) {
      await tx.insert(requestVotes).values(voters.map((voter) => ({ requestId: votedRequestId, userId: voter }))).onConflictDoNothing();
    }
  }
  await tx
    .update(measurementRequests)
    .set({
      voteCount: sql`(select ${count()} from ${requestVotes} where ${requestVotes.requestId} = ${measurementRequests.id})`,
    })
    .where(inArray(measurementRequests.id, seededIds));

  const createdAt = (requestId: string, laterDays: number) =>
    new Date(Date.now() - (demoRequests.find((request) => request.id === requestId)!.daysAgo - laterDays) * day);
  const history = [
    { id: historyIds.planned, subjectId: seededRequestIds.planned, action: "request.status_changed", details: { from: "open", to: "planned" }, createdAt: createdAt(seededRequestIds.planned, 4) },
    {
      id: historyIds.declined,
      subjectId: seededRequestIds.declined,
      action: "request.status_changed",
      details: { from: "open", to: "declined", reason: declinedReason },
      createdAt: createdAt(seededRequestIds.declined, 2),
    },
    {
      id: historyIds.merged,
      subjectId: seededRequestIds.mergedDuplicate,
      action: "request.merged",
      details: { from: "open", into: seededRequestIds.mostWanted, votesGained: 0 },
      createdAt: createdAt(seededRequestIds.mergedDuplicate, 1),
    },
    ...(answeringReport
      ? [
          {
            id: historyIds.measured,
            subjectId: seededRequestIds.measured,
            action: "request.status_changed",
            details: { from: "planned", to: "measured", reportId: answeringReport.id },
            createdAt: createdAt(seededRequestIds.measured, 30),
          },
        ]
      : []),
  ];
  await tx
    .insert(auditLog)
    .values(history.map((entry) => ({ ...entry, actorId: editorId, subjectType: "measurement_request" })))
    .onConflictDoNothing({ target: auditLog.id });

  // Rows with everything switched on, as a new account gets them; an existing row keeps its settings and token.
  await tx
    .insert(notificationPreferences)
    .values(people.map((person) => ({ userId: person.id })))
    .onConflictDoNothing();

  const measuredNote = answeringReport ? "" : " (no submitted or published report yet, so no measured request)";
  return `${seeded.length} measurement requests${measuredNote}, ${history.length} history entries, e-mail settings for ${people.length} people`;
}
