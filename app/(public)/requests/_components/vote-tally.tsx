import Link from "next/link";
import { VoteButton } from "./vote-button";

/** The vote button where voting is open and the reader signed in; otherwise the count, and the way to vote. */
export function VoteTally({
  requestId,
  status,
  merged,
  voteCount,
  voted,
  signedIn,
  label,
}: {
  requestId: string;
  status: string;
  merged: boolean;
  voteCount: number;
  voted: boolean;
  signedIn: boolean;
  label: string;
}) {
  const votingOpen = !merged && (status === "open" || status === "planned");
  if (votingOpen && signedIn) return <VoteButton requestId={requestId} voted={voted} voteCount={voteCount} label={label} />;
  return (
    <div className="flex min-w-16 flex-col items-center text-sm">
      <span className="figure text-lg leading-tight">{voteCount}</span>
      <span className="text-xs text-ink-faint">{voteCount === 1 ? "vote" : "votes"}</span>
      {votingOpen ? (
        <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/requests/${requestId}`)}`} className="mt-1 text-xs font-semibold text-copper hover:underline">
          Sign in to vote
        </Link>
      ) : null}
    </div>
  );
}
