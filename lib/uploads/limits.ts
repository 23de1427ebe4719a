import type { UPLOAD_PURPOSES } from "@/db/schema/uploads";

// What each upload route takes. Shared by the file router (the authority) and the client
// uploaders (instant feedback before any byte is sent), so both name the same limits.

/** uploadthing counts "MB" as 1024² bytes (fileSizeToBytes in @uploadthing/shared); so do we. */
export const MB = 1024 * 1024;

// A type-only import keeps drizzle out of the browser bundle.
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number];

export type UploadRouteName = "listingPhoto" | "listingDocument" | "readingPhoto" | "capture";

export type UploadRouteRule = {
  purpose: UploadPurpose;
  /** What the file is, in the words of a refusal: "photos", "documents". */
  noun: string;
  maxBytes: number;
  /** Files per request; the listing form also holds the total (8 photos). */
  maxFiles: number;
  /** Content types a browser may declare; the bytes are checked again after upload. */
  contentTypes: readonly string[];
  /** For the file picker's `accept`. */
  accept: string;
  /** Roles that may use the route; undefined means any signed-in member. */
  roles?: readonly ["seller"];
};

export const PHOTO_CONTENT_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;

export const UPLOAD_ROUTES: Record<UploadRouteName, UploadRouteRule> = {
  listingPhoto: {
    purpose: "listing-photo",
    noun: "listing photos",
    maxBytes: 10 * MB,
    maxFiles: 8,
    contentTypes: PHOTO_CONTENT_TYPES,
    accept: "image/jpeg,image/png,image/webp,.jpg,.jpeg,.png,.webp",
    roles: ["seller"],
  },
  listingDocument: {
    purpose: "listing-document",
    noun: "listing documents",
    maxBytes: 20 * MB,
    maxFiles: 8,
    contentTypes: ["application/pdf"],
    accept: "application/pdf,.pdf",
    roles: ["seller"],
  },
  readingPhoto: {
    purpose: "reading-photo",
    noun: "reading photos",
    maxBytes: 10 * MB,
    maxFiles: 6,
    contentTypes: PHOTO_CONTENT_TYPES,
    accept: "image/jpeg,image/png,image/webp,.jpg,.jpeg,.png,.webp",
  },
  capture: {
    purpose: "capture",
    noun: "captures",
    maxBytes: 50 * MB,
    maxFiles: 4,
    // The declared type is what the store later serves the file as, so nothing a browser
    // would render as a page or run as a script.
    // Windows browsers with a spreadsheet program installed declare .csv as application/vnd.ms-excel.
    contentTypes: ["text/csv", "text/plain", "text/tab-separated-values", "application/vnd.ms-excel", "application/octet-stream", ""],
    accept: ".csv,.tsv,.txt,.bin,.dat,text/csv,text/plain",
  },
};

/** The photo count of a listing; also the listing route's per-request limit. */
export const MAX_LISTING_PHOTOS = UPLOAD_ROUTES.listingPhoto.maxFiles;

/** "10 MB", "512 KB": the same units the limits are written in. */
export function formatBytes(bytes: number): string {
  if (bytes >= MB) {
    const mb = bytes / MB;
    return `${Number.isInteger(mb) ? mb : mb.toFixed(1)} MB`;
  }
  if (bytes >= 1024) return `${Math.ceil(bytes / 1024)} KB`;
  return `${bytes} bytes`;
}

export type DeclaredFile = { name: string; size: number; type: string };

/**
 * Why a file may not even start uploading on this route, or null. Checks only what the browser
 * declares (name, size, type); the content is checked after upload.
 */
export function refuseDeclaredFile(route: UploadRouteName, file: DeclaredFile): string | null {
  const rule = UPLOAD_ROUTES[route];
  if (file.size > rule.maxBytes) {
    return `${file.name} is ${formatBytes(file.size)}; ${rule.noun} can be at most ${formatBytes(rule.maxBytes)}.`;
  }
  if (file.size === 0) return `${file.name} is empty.`;
  if (!rule.contentTypes.includes(file.type)) {
    return `${file.name} is not ${describeAllowed(route)}.`;
  }
  return null;
}

export function describeAllowed(route: UploadRouteName): string {
  switch (UPLOAD_ROUTES[route].purpose) {
    case "listing-photo":
    case "reading-photo":
      return "a JPEG, PNG or WebP photo";
    case "listing-document":
      return "a PDF";
    case "capture":
      return "a CSV, text or raw data file";
  }
}
