"use client";

import { useRouter } from "next/navigation";
import { useId, useState, type FormEvent } from "react";
import { fieldErrorsOf } from "@/lib/form-data";
import { captureKindLabels, captureKinds, captureLimits, captureUploadRequestSchema } from "@/lib/validations/runs";
import { narrowFields } from "../../_components/narrow-fields";

type Phase = { step: "idle" } | { step: "uploading"; percent: number } | { step: "confirming" } | { step: "failed"; message: string };

type ErrorBody = { error?: { message?: string; fieldErrors?: Record<string, string[]> } };

async function postJson(url: string, body?: unknown): Promise<{ ok: boolean; status: number; data: unknown }> {
  const response = await fetch(url, {
    method: "POST",
    headers: body === undefined ? undefined : { "Content-Type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { ok: response.ok, status: response.status, data: await response.json().catch(() => null) };
}

/** PUTs the file straight to object storage, reporting progress; XMLHttpRequest because fetch has no upload progress. */
function putWithProgress(url: string, headers: Record<string, string>, file: File, onProgress: (percent: number) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open("PUT", url);
    for (const [name, value] of Object.entries(headers)) request.setRequestHeader(name, value);
    request.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(Math.round((event.loaded / event.total) * 100));
    };
    request.onload = () => (request.status >= 200 && request.status < 300 ? resolve() : reject(new Error(`storage answered ${request.status}`)));
    request.onerror = () => reject(new Error("the connection to storage failed"));
    request.send(file);
  });
}

export function CaptureUpload({ runId }: { runId: string }) {
  const router = useRouter();
  const fileInputId = useId();
  const [phase, setPhase] = useState<Phase>({ step: "idle" });
  const [fieldErrors, setFieldErrors] = useState<Record<string, string[]>>({});
  const busy = phase.step === "uploading" || phase.step === "confirming";

  async function upload(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const file = form.get("file");
    const request = {
      runId,
      kind: form.get("kind"),
      fileName: file instanceof File ? file.name : undefined,
      sizeBytes: file instanceof File ? file.size : undefined,
    };
    const checked = captureUploadRequestSchema.safeParse(request);
    if (!checked.success || !(file instanceof File)) {
      setFieldErrors(checked.success ? { fileName: ["Choose a file."] } : fieldErrorsOf(checked.error));
      setPhase({ step: "idle" });
      return;
    }
    setFieldErrors({});
    setPhase({ step: "uploading", percent: 0 });
    try {
      const started = await postJson("/api/captures", checked.data);
      if (!started.ok) {
        const problem = (started.data as ErrorBody | null)?.error;
        setFieldErrors(problem?.fieldErrors ?? {});
        setPhase({ step: "failed", message: problem?.message ?? `The upload could not start (${started.status}).` });
        return;
      }
      const { upload: target, confirmUrl } = started.data as { upload: { url: string; headers: Record<string, string> }; confirmUrl: string };
      await putWithProgress(target.url, target.headers, file, (percent) => setPhase({ step: "uploading", percent }));
      setPhase({ step: "confirming" });
      const confirmed = await postJson(confirmUrl);
      if (!confirmed.ok) {
        setPhase({ step: "failed", message: (confirmed.data as ErrorBody | null)?.error?.message ?? `The upload was not confirmed (${confirmed.status}).` });
        return;
      }
      router.push((confirmed.data as { mappingUrl: string }).mappingUrl);
    } catch (error) {
      setPhase({ step: "failed", message: `The upload failed: ${error instanceof Error ? error.message : String(error)}. Try again.` });
    }
  }

  const fileErrors = [...(fieldErrors.fileName ?? []), ...(fieldErrors.sizeBytes ?? [])];
  return (
    <form onSubmit={upload} className={`grid gap-4 rounded border border-rule bg-paper-raised p-4 sm:grid-cols-2 ${narrowFields}`} noValidate>
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-semibold">What the capture holds</legend>
        {captureKinds.map((kind, index) => (
          <label key={kind} className="flex items-center gap-2 text-sm">
            <input type="radio" name="kind" value={kind} defaultChecked={index === 0} className="accent-copper" />
            {captureKindLabels[kind]}
          </label>
        ))}
        {fieldErrors.kind ? <p className="text-sm text-copper-deep">{fieldErrors.kind.join(" ")}</p> : null}
      </fieldset>
      <div className="flex flex-col gap-1">
        <label htmlFor={fileInputId} className="text-sm font-semibold">
          Capture file
        </label>
        <input
          id={fileInputId}
          name="file"
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/plain,text/tab-separated-values"
          aria-invalid={fileErrors.length ? true : undefined}
          aria-describedby={`${fileInputId}-hint${fileErrors.length ? ` ${fileInputId}-error` : ""}`}
          className="text-sm"
        />
        <p id={`${fileInputId}-hint`} className="text-xs text-ink-faint">
          A CSV, TSV or TXT export up to {captureLimits.maxBytes / 1024 / 1024} MB. It goes straight to storage; you map its columns next.
        </p>
        {fileErrors.length ? (
          <p id={`${fileInputId}-error`} className="text-sm text-copper-deep">
            {fileErrors.join(" ")}
          </p>
        ) : null}
      </div>
      <div className="flex flex-col gap-2 sm:col-span-2">
        {phase.step === "uploading" || phase.step === "confirming" ? (
          <div className="space-y-1">
            <div
              role="progressbar"
              aria-label="Upload progress"
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={phase.step === "uploading" ? phase.percent : 100}
              className="h-3 w-full overflow-hidden rounded bg-paper-sunk"
            >
              <div className="h-full bg-verdigris transition-[width]" style={{ width: `${phase.step === "uploading" ? phase.percent : 100}%` }} />
            </div>
            <p className="figure text-xs text-ink-soft" aria-live="polite">
              {phase.step === "uploading" ? `${phase.percent} % uploaded` : "Checking what arrived…"}
            </p>
          </div>
        ) : null}
        {phase.step === "failed" ? (
          <p role="alert" className="text-sm text-copper-deep">
            {phase.message}
          </p>
        ) : null}
        <div>
          <button type="submit" disabled={busy} className="rounded bg-ink px-4 py-2 font-semibold text-paper-raised hover:bg-ink-soft disabled:opacity-60">
            {busy ? "Uploading…" : "Upload capture"}
          </button>
        </div>
      </div>
    </form>
  );
}
