// The background worker: works every queue in lib/jobs.ts until SIGINT or SIGTERM, then lets the job in hand finish.
// Run with `npm run worker` (tsx with the react-server condition, so the server-only modules it shares with the app load).
import { setPriority } from "node:os";
import { closeDatabase } from "@/db";
import { runCaptureAnalysis } from "@/lib/capture-analysis";
import { ABANDONED_AFTER_MS, cleanUpAbandonedUploads } from "@/lib/capture-uploads";
import { publishDueRevisions } from "@/lib/editorial";
import { queues, startJobQueue, type AnalyseCaptureJob } from "@/lib/jobs";
import { deliverPendingMail } from "@/lib/outbox";

// An analysis holds a core for seconds; below the web server's priority it never slows a page on a shared machine.
setPriority(10);

const boss = await startJobQueue({ role: "worker" });

await boss.work<AnalyseCaptureJob>(queues.analyseCapture, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
  if (!job) return;
  const started = performance.now();
  const outcome = await runCaptureAnalysis(job.data);
  console.log(`worker: analysis ${job.data.analysisId} ${outcome} in ${Math.round(performance.now() - started)} ms`);
});

await boss.schedule(queues.cleanUpUploads, "*/10 * * * *");
await boss.work(queues.cleanUpUploads, { batchSize: 1 }, async () => {
  const removed = await cleanUpAbandonedUploads({ olderThan: new Date(Date.now() - ABANDONED_AFTER_MS) });
  if (removed.rows || removed.objects) console.log(`worker: removed ${removed.rows} abandoned uploads and ${removed.objects} orphaned objects`);
});

// Woken after each outbox write; the minutely sweep retries what failed and covers a lost wake-up.
await boss.schedule(queues.deliverMail, "* * * * *", {}, { singletonKey: queues.deliverMail });
await boss.work(queues.deliverMail, { batchSize: 1, pollingIntervalSeconds: 1 }, async () => {
  const tally = await deliverPendingMail();
  if (tally.sent || tally.retrying || tally.failed) {
    console.log(`worker: mail sent ${tally.sent}, to retry ${tally.retrying}, failed ${tally.failed}`);
  }
});

// Reports the desk approved for a later time go live within a minute of it. Reader pages look up the current revision on
// every request, so nothing cached needs clearing from here.
await boss.schedule(queues.publishScheduled, "* * * * *");
await boss.work(queues.publishScheduled, { batchSize: 1 }, async () => {
  const published = await publishDueRevisions();
  if (published.length) console.log(`worker: published scheduled revisions of ${published.join(", ")}`);
});

console.log(`worker ready: ${Object.values(queues).join(", ")}`);

let stopping = false;
async function stop(signal: NodeJS.Signals) {
  if (stopping) return;
  stopping = true;
  console.log(`worker: ${signal}, finishing the job in hand`);
  await boss.stop({ graceful: true, wait: true, timeout: 60_000 });
  await closeDatabase();
  process.exit(0);
}
process.on("SIGINT", (signal) => void stop(signal));
process.on("SIGTERM", (signal) => void stop(signal));
