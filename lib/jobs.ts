import "server-only";
import PgBoss from "pg-boss";
import { serverEnv } from "@/lib/env";

/** Background work on the Postgres-backed queue; scripts/worker.ts works every queue named here. */
export const queues = {
  analyseCapture: "analyse-capture",
  cleanUpUploads: "clean-up-uploads",
  deliverMail: "deliver-mail",
  publishScheduled: "publish-scheduled",
} as const;

// "short" keeps one waiting job per singleton key, so an analysis queued twice is worked once.
const queuePolicies: Record<(typeof queues)[keyof typeof queues], PgBoss.QueuePolicy> = {
  "analyse-capture": "short",
  "clean-up-uploads": "singleton",
  // One run waiting and one running: wake-ups during a run queue exactly one more, a burst of them collapses into it.
  "deliver-mail": "stately",
  // A minutely sweep: one run at a time is enough, a missed minute is caught by the next.
  "publish-scheduled": "singleton",
};

export type AnalyseCaptureJob = { analysisId: string };

/**
 * A queue connection. The app only sends, so it runs no maintenance or cron of its own (the worker does); both
 * create the queues, because pg-boss refuses to send to a queue that does not exist yet.
 */
export async function startJobQueue({ role }: { role: "sender" | "worker" }): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: serverEnv().DATABASE_URL,
    max: role === "sender" ? 2 : 4,
    supervise: role === "worker",
    schedule: role === "worker",
  });
  boss.on("error", (error) => console.error("job queue:", error.message));
  await boss.start();
  for (const name of Object.values(queues)) await boss.createQueue(name, { name, policy: queuePolicies[name] });
  return boss;
}

// Development reloads modules; one sender per process keeps the connection count fixed.
const globalForJobs = globalThis as unknown as { benchplateJobSender?: Promise<PgBoss> };

function jobSender(): Promise<PgBoss> {
  globalForJobs.benchplateJobSender ??= startJobQueue({ role: "sender" }).catch((error: unknown) => {
    globalForJobs.benchplateJobSender = undefined;
    throw error;
  });
  return globalForJobs.benchplateJobSender;
}

/**
 * Call only after the transaction that wrote the analysis row has committed, or the worker may look for a row it
 * cannot see yet. The analysis id is the singleton key, so a double submit queues the work once.
 */
export async function enqueueAnalysis(job: AnalyseCaptureJob): Promise<void> {
  const boss = await jobSender();
  await boss.send(queues.analyseCapture, job, { singletonKey: job.analysisId, retryLimit: 2, retryDelay: 5, expireInMinutes: 20 });
}

/** Wakes the mail sender after an outbox write committed; the singleton key folds many wake-ups into one run. */
export async function requestMailDelivery(): Promise<void> {
  const boss = await jobSender();
  await boss.send(queues.deliverMail, {}, { singletonKey: queues.deliverMail, retryLimit: 0, expireInMinutes: 10 });
}
