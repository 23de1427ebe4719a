import type { ReviewDocument, ReviewPhoto } from "@/db/queries/moderation";
import { formatSi } from "@/components/ui/format";

/** Thumbnails of the cleaned uploads (each opens the full photo) and the documents. */
export function ListingMedia({ photos, documents }: { photos: ReviewPhoto[]; documents: ReviewDocument[] }) {
  return (
    <div className="space-y-4">
      {photos.length === 0 ? (
        <p className="text-signal-700">No photos: a listing needs at least one before it can be submitted.</p>
      ) : (
        <ul className="flex flex-wrap gap-3" aria-label="Photos" data-testid="listing-photos">
          {photos.map((p) => (
            <li key={p.position} className="w-40">
              <a href={p.url} target="_blank" rel="noopener noreferrer" className="block">
                {/* Plain <img>: uploads come from the uploads host at sizes only the upload knows. */}
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img src={p.thumbUrl ?? p.url} alt={p.alt || `Photo ${p.position + 1}`} width={160} height={120} className="h-28 w-40 rounded border border-graphite-200 object-cover" />
              </a>
              <p className="mt-1 text-xs text-graphite-600">
                {p.position === 0 ? "Cover · " : ""}
                {p.width && p.height ? `${p.width} × ${p.height} px` : ""}
              </p>
            </li>
          ))}
        </ul>
      )}
      {documents.length === 0 ? (
        <p className="text-sm text-graphite-600">No documents.</p>
      ) : (
        <ul className="space-y-1 text-sm" aria-label="Documents">
          {documents.map((d) => (
            <li key={d.url}>
              <a href={d.url} target="_blank" rel="noopener noreferrer">
                {d.title}
              </a>{" "}
              <span className="text-graphite-600">
                · {d.kind} · PDF, <span className="font-mono">{formatSi(d.bytes, "B", 2)}</span>
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
