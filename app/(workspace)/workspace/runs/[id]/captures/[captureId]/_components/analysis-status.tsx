"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";

type Status = "queued" | "running" | "done" | "failed";

const labels: Record<Status, string> = {
  queued: "Queued: waiting for the analysis worker…",
  running: "Analysing: reading the capture and working out the figures…",
  done: "Done: loading the figures…",
  failed: "Failed: loading the reason…",
};

/**
 * Polls the analysis every second while it waits or runs; once it ends, the server renders the figures (or the
 * failure) in place of this note.
 */
export function AnalysisStatus({ analysisId, initialStatus }: { analysisId: string; initialStatus: Status }) {
  const router = useRouter();
  const [status, setStatus] = useState<Status>(initialStatus);
  const [elapsed, setElapsed] = useState(0);

  useEffect(() => {
    let stopped = false;
    const started = Date.now();
    const timer = setInterval(async () => {
      setElapsed(Math.round((Date.now() - started) / 1000));
      try {
        const response = await fetch(`/api/analyses/${analysisId}`, { cache: "no-store" });
        if (!response.ok || stopped) return;
        const body = (await response.json()) as { status: Status };
        setStatus(body.status);
        if (body.status === "done" || body.status === "failed") {
          stopped = true;
          clearInterval(timer);
          router.refresh();
        }
      } catch {
        // A dropped poll is retried on the next tick.
      }
    }, 1000);
    return () => {
      stopped = true;
      clearInterval(timer);
    };
  }, [analysisId, router]);

  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 rounded border border-verdigris bg-verdigris-wash px-4 py-3 text-sm">
      <span aria-hidden="true" className="inline-block size-3 animate-pulse rounded-full bg-verdigris" />
      <span>
        {labels[status]} <span className="figure text-ink-faint">{elapsed} s</span>
      </span>
    </div>
  );
}
