import "server-only";
import { checkAccess } from "@/lib/auth/guard";
import { buildUploadRouter } from "@/lib/uploads/file-router";

// The app's file routes: listing photos and documents (sellers), reading photos and captures
// (any member). The session guard is `checkAccess`, the decision `requireUser` throws on.
export const uploadRouter = buildUploadRouter({ authorize: (_request, anyOf) => checkAccess(anyOf) });

export type UploadRouter = typeof uploadRouter;
