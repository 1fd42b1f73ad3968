import type { ToolPhotoView } from "@/db/queries/tool-photos";

/** Responsive photos: the browser picks the smallest rendition that fills the slot at its pixel density. */
export function ToolPhotoGallery({ photos }: { photos: ToolPhotoView[] }) {
  const [lead, ...rest] = photos;
  if (!lead) return null;
  return (
    <section aria-label="Photos" className="grid gap-3 sm:grid-cols-3">
      <ToolPhoto photo={lead} sizes="(min-width: 640px) 66vw, 100vw" className="sm:col-span-2 sm:row-span-2" eager />
      {rest.map((photo) => (
        <ToolPhoto key={photo.id} photo={photo} sizes="(min-width: 640px) 33vw, 100vw" />
      ))}
    </section>
  );
}

function ToolPhoto({ photo, sizes, className = "", eager = false }: { photo: ToolPhotoView; sizes: string; className?: string; eager?: boolean }) {
  const source = (width: number) => `/api/tool-photos/${photo.id}/${width}`;
  const largest = photo.widths.length - 1;
  return (
    <figure className={`overflow-hidden rounded border border-rule bg-paper-raised ${className}`}>
      {/* A plain img with srcset: the handler already serves re-encoded WebP renditions at fixed widths. */}
      <img
        src={source(photo.widths[0]!)}
        srcSet={photo.widths.map((width) => `${source(width)} ${width}w`).join(", ")}
        sizes={sizes}
        width={photo.widths[largest]}
        height={photo.heights[largest]}
        alt={photo.altText}
        loading={eager ? "eager" : "lazy"}
        decoding="async"
        className="h-auto w-full"
      />
    </figure>
  );
}
