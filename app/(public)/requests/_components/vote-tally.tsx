import Link from "next/link";
import type { MeasurementRequestSummary } from "@/db/queries/measurement-requests";
import { VoteButton } from "./vote-button";

/** The vote button where voting is open and the reader signed in; otherwise the count, and the way to vote. */
export function VoteTally({ request, signedIn }: { request: MeasurementRequestSummary; signedIn: boolean }) {
  const votingOpen = request.mergedIntoId === null && (request.status === "open" || request.status === "planned");
  if (votingOpen && signedIn) {
    return <VoteButton requestId={request.id} voted={request.viewerVoted} voteCount={request.voteCount} label={request.toolName} />;
  }
  return (
    <div className="flex min-w-16 flex-col items-center text-sm">
      <span className="figure text-lg leading-tight">{request.voteCount}</span>
      <span className="text-xs text-ink-faint">{request.voteCount === 1 ? "vote" : "votes"}</span>
      {votingOpen ? (
        <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/requests/${request.id}`)}`} className="mt-1 text-xs font-semibold text-copper hover:underline">
          Sign in to vote
        </Link>
      ) : null}
    </div>
  );
}
