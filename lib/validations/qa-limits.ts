import { UPLOAD_ROUTES } from "@/lib/uploads/limits";

// The Q&A's limits without its schemas: client forms import these, and importing ./qa.ts would
// put all of Zod on every page with a question form (the listing page among them).

export const QUESTION_TITLE_MAX = 160;
export const POST_BODY_MAX = 20_000;
export const MAX_POST_PHOTOS = UPLOAD_ROUTES.readingPhoto.maxFiles;
