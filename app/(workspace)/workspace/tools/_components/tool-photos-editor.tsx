"use client";

import { useActionState } from "react";
import { addToolPhoto, deleteToolPhoto } from "@/app/(workspace)/workspace/tools/actions";
import { FormStatus, SubmitButton, TextField } from "@/components/ui/form-controls";
import { useCheckedAction } from "@/components/ui/use-checked-action";
import { idleActionState } from "@/lib/action-state";
import { photoLimits, toolPhotoUploadSchema } from "@/lib/validations/tool";

type Photo = { id: string; widths: number[]; heights: number[]; altText: string };

export function ToolPhotosEditor({ slug, photos }: { slug: string; photos: Photo[] }) {
  const [state, formAction, pending] = useCheckedAction(addToolPhoto, toolPhotoUploadSchema);
  const photoErrors = state.fieldErrors?.photo;
  return (
    <section aria-labelledby="photos-heading" className="space-y-4">
      <h2 id="photos-heading" className="font-serif text-2xl">
        Photos
      </h2>
      {photos.length ? (
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {photos.map((photo) => (
            <li key={photo.id} className="space-y-2 rounded border border-rule bg-paper-raised p-3">
              {/* A plain img: the handler already serves re-encoded WebP renditions; next/image would re-encode them again. */}
              <img
                src={`/api/tool-photos/${photo.id}/${photo.widths[0]}`}
                width={photo.widths[0]}
                height={photo.heights[0]}
                alt={photo.altText}
                className="h-auto w-full rounded"
              />
              <p className="text-sm text-ink-soft">{photo.altText}</p>
              <p className="figure text-xs text-ink-faint">{photo.widths.join(" · ")} px wide</p>
              <DeletePhotoButton slug={slug} photoId={photo.id} />
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-soft">No photos yet.</p>
      )}

      <form action={formAction} noValidate className="max-w-xl space-y-3 rounded border border-rule bg-paper-raised p-4">
        <h3 className="font-semibold">Add a photo</h3>
        <input type="hidden" name="slug" value={slug} />
        <div className="flex flex-col gap-1">
          <label htmlFor="photo" className="text-sm font-semibold">
            Photo
          </label>
          <input
            id="photo"
            name="photo"
            type="file"
            accept="image/jpeg,image/png,image/webp,image/avif"
            aria-invalid={photoErrors?.length ? true : undefined}
            aria-describedby={`photo-hint${photoErrors?.length ? " photo-error" : ""}`}
            className="text-sm"
          />
          <p id="photo-hint" className="text-xs text-ink-faint">
            JPEG, PNG, WebP or AVIF up to {photoLimits.maxBytes / 1024 / 1024} MB. Stored as WebP at {photoLimits.widths.join(", ")} px wide
            (never enlarged), with camera and location data removed.
          </p>
          {photoErrors?.length ? (
            <p id="photo-error" className="text-sm text-copper-deep">
              {photoErrors.join(" ")}
            </p>
          ) : null}
        </div>
        <TextField
          label="Alt text"
          name="altText"
          errors={state.fieldErrors}
          values={state.values}
          hint="What the photo shows, for readers who cannot see it, e.g. “Station front panel with the handle in its cradle”."
        />
        <FormStatus status={state.status} message={state.message} />
        <SubmitButton pending={pending}>Upload photo</SubmitButton>
      </form>
    </section>
  );
}

function DeletePhotoButton({ slug, photoId }: { slug: string; photoId: string }) {
  const [state, formAction, pending] = useActionState(deleteToolPhoto, idleActionState);
  return (
    <form action={formAction}>
      <input type="hidden" name="slug" value={slug} />
      <input type="hidden" name="photoId" value={photoId} />
      <button type="submit" disabled={pending} className="text-sm font-semibold text-copper-deep hover:underline disabled:opacity-60">
        {pending ? "Deleting…" : "Delete photo"}
      </button>
      {state.status === "error" ? <p className="text-sm text-copper-deep">{state.message}</p> : null}
    </form>
  );
}
