import "server-only";
import { createUploadthing, type FileRouter } from "uploadthing/next";
import { UploadThingError } from "uploadthing/server";
import type { Role } from "@/db/schema/users";
import type { AccessDecision } from "@/lib/auth/access";
import { refuseDeclaredFile, UPLOAD_ROUTES, type UploadRouteName } from "./limits";
import { processUploadedFile } from "./process-upload";

/**
 * Who is uploading: the app passes the session guard (`checkAccess`, the decision `requireUser`
 * throws on); tests pass one that reads a test header.
 */
export type AuthorizeUpload = (request: Request, anyOf: readonly Role[] | undefined) => Promise<AccessDecision>;

// The SDK's own size check only takes powers of two ("16MB"); it is the outer bound, and the
// exact limits of UPLOAD_ROUTES are applied in the middleware with a message a person can act on.
export function buildUploadRouter({ authorize }: { authorize: AuthorizeUpload }) {
  const f = createUploadthing();

  const gate =
    (route: UploadRouteName) =>
    async ({ req, files }: { req: Request; files: readonly { name: string; size: number; type: string }[] }) => {
      const rule = UPLOAD_ROUTES[route];
      const decision = await authorize(req, rule.roles);
      if (!decision.ok) {
        const message = decision.status === 401 ? "Sign in to upload files." : `Only sellers can upload ${rule.noun}.`;
        throw new UploadThingError({ code: "FORBIDDEN", message });
      }
      if (files.length > rule.maxFiles) {
        throw new UploadThingError({ code: "TOO_MANY_FILES", message: `Upload at most ${rule.maxFiles} ${rule.noun} at a time.` });
      }
      for (const file of files) {
        const refusal = refuseDeclaredFile(route, file);
        if (refusal) throw new UploadThingError({ code: "BAD_REQUEST", message: refusal });
      }
      return { ownerId: decision.user.id };
    };

  const complete =
    (route: UploadRouteName) =>
    ({ file, metadata }: { file: { key: string; name: string; size: number; type: string; ufsUrl: string }; metadata: { ownerId: string } }) =>
      processUploadedFile({
        route,
        ownerId: metadata.ownerId,
        file: { key: file.key, name: file.name, size: file.size, type: file.type, url: file.ufsUrl },
      });

  return {
    listingPhoto: f({ image: { maxFileSize: "16MB", maxFileCount: UPLOAD_ROUTES.listingPhoto.maxFiles } })
      .middleware(gate("listingPhoto"))
      .onUploadComplete(complete("listingPhoto")),
    listingDocument: f({ pdf: { maxFileSize: "32MB", maxFileCount: UPLOAD_ROUTES.listingDocument.maxFiles } })
      .middleware(gate("listingDocument"))
      .onUploadComplete(complete("listingDocument")),
    readingPhoto: f({ image: { maxFileSize: "16MB", maxFileCount: UPLOAD_ROUTES.readingPhoto.maxFiles } })
      .middleware(gate("readingPhoto"))
      .onUploadComplete(complete("readingPhoto")),
    capture: f({ blob: { maxFileSize: "64MB", maxFileCount: UPLOAD_ROUTES.capture.maxFiles } })
      .middleware(gate("capture"))
      .onUploadComplete(complete("capture")),
  } satisfies FileRouter;
}

export type UploadRouter = ReturnType<typeof buildUploadRouter>;
