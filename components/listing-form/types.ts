// Names the form shares with the database schema, as types only (nothing of drizzle reaches the browser bundle).
export type { BringUpStage, ListingKind, MagneticSubtype } from "@/db/schema/listings";
import type { DOCUMENT_KINDS } from "@/db/schema/listings";
export type DocumentKindValue = (typeof DOCUMENT_KINDS)[number];
