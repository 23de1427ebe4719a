"use client";

import { Panel } from "@/components/ui/panel";
import { DocumentUploader } from "@/components/uploads/document-uploader";
import { PhotoUploader } from "@/components/uploads/photo-uploader";
import { MAX_DOCUMENTS, MAX_PHOTOS } from "@/lib/validations/listings";
import type { SectionProps } from "./form-context";

export function MediaSection({ values, set, errors }: SectionProps) {
  return (
    <Panel title="Photos and documents">
      <div className="space-y-6">
        <PhotoUploader
          value={values.photos}
          onChange={(photos) => set("photos", photos)}
          max={MAX_PHOTOS}
          label="Photos (the first is the cover)"
          error={errors.photos ?? Object.entries(errors).find(([k]) => k.startsWith("photos."))?.[1]}
        />
        <DocumentUploader
          value={values.documents}
          onChange={(documents) => set("documents", documents)}
          max={MAX_DOCUMENTS}
          label="Documents (PDF: schematic, BOM, build notes)"
          error={errors.documents ?? Object.entries(errors).find(([k]) => k.startsWith("documents."))?.[1]}
        />
      </div>
    </Panel>
  );
}
