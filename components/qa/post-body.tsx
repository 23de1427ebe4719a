import { Markdown } from "@/components/markdown";
import type { PostPhotoView } from "@/db/queries/qa";

/**
 * A question's or answer's text and photos. The text goes through the one sanitised Markdown
 * renderer, with images allowed only from the uploads host (`imageOrigins`).
 */
export function PostBody({ bodyMd, photos, imageOrigins, label }: { bodyMd: string; photos: readonly PostPhotoView[]; imageOrigins: readonly string[]; label: string }) {
  return (
    <div className="space-y-4">
      <Markdown imageOrigins={imageOrigins} minHeadingLevel={3}>
        {bodyMd}
      </Markdown>
      {photos.length > 0 ? (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label={`Photos of ${label}`}>
          {photos.map((photo) => (
            <li key={photo.key}>
              <a href={photo.url} className="block">
                {/* eslint-disable-next-line @next/next/no-img-element -- served by the upload provider */}
                <img
                  src={photo.thumbUrl}
                  alt={`Photo ${photo.position + 1} of ${label}`}
                  width={photo.width ?? undefined}
                  height={photo.height ?? undefined}
                  loading="lazy"
                  className="aspect-[4/3] w-full rounded border border-graphite-200 object-cover"
                />
              </a>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
