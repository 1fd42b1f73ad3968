"use client";

import { TextField } from "@/components/ui/form-controls";
import { deleteReportImageSchema, reportImageLimits, reportImageUploadSchema } from "@/lib/validations/reports";
import { deleteReportImage, uploadReportImage } from "../actions";
import { ActionForm } from "@/components/ui/action-form";

export type ImageRow = { id: string; name: string; altText: string; width: number; height: number };

export function ImagesPanel({ reportId, images }: { reportId: string; images: ImageRow[] }) {
  return (
    <section aria-labelledby="images-heading" className="space-y-3">
      <h2 id="images-heading" className="font-serif text-2xl">
        Images
      </h2>
      <p className="max-w-3xl text-sm text-ink-soft">
        Setup photos and scope screenshots. Each is re-encoded (metadata such as camera and location removed) and needs a description for readers
        who cannot see it. Place one with <code className="figure">&lt;Figure image=&quot;name&quot; caption=&quot;…&quot; /&gt;</code>.
      </p>
      {images.length ? (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {images.map((image) => (
            <li key={image.id} className="space-y-2 rounded border border-rule bg-paper-raised p-3 text-sm">
              {/* Served by our own handler at the stored size; next/image would only re-fetch it. */}
              <img src={`/api/report-images/${image.id}`} alt={image.altText} width={image.width} height={image.height} className="h-32 w-full rounded object-cover" />
              <p>
                <span className="figure font-semibold">{image.name}</span> · {image.width}×{image.height}
              </p>
              <p className="text-ink-soft">{image.altText}</p>
              <ActionForm action={deleteReportImage} schema={deleteReportImageSchema} hidden={{ reportId, imageId: image.id }} submitLabel={`Delete ${image.name}`} />
            </li>
          ))}
        </ul>
      ) : null}
      <ActionForm
        action={uploadReportImage}
        schema={reportImageUploadSchema}
        hidden={{ reportId }}
        submitLabel="Upload image"
        encType="multipart/form-data"
        className="grid max-w-3xl gap-3 rounded border border-rule bg-paper-sunk p-3"
        fields={(errors, values) => (
          <>
            <div className="grid gap-3 sm:grid-cols-2">
              <TextField label="Name" name="name" errors={errors} values={values} key={`name-${values?.name}`} placeholder="e.g. bench-setup" hint="Lower case, digits, hyphens." />
              <div className="flex flex-col gap-1">
                <label htmlFor="image" className="text-sm font-semibold">
                  Image file
                </label>
                <input id="image" name="image" type="file" accept="image/png,image/jpeg,image/webp,image/gif,image/avif" className="text-sm" aria-describedby="image-hint" />
                <p id="image-hint" className="text-xs text-ink-faint">
                  PNG, JPEG, WebP, GIF or AVIF up to {reportImageLimits.maxBytes / 1024 / 1024} MB; stored at most {reportImageLimits.maxWidth} px wide.
                </p>
                {errors?.image ? <p className="text-sm text-copper-deep">{errors.image.join(" ")}</p> : null}
              </div>
            </div>
            <TextField
              label="Alt text (required)"
              name="altText"
              errors={errors}
              values={values}
              key={`alt-${values?.altText}`}
              hint="What the picture shows, for readers who cannot see it: e.g. “Clamp probe around the live conductor of the station's mains lead”."
            />
          </>
        )}
      />
    </section>
  );
}
