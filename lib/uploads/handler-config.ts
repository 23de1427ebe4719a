import "server-only";
import { env } from "@/lib/env";

/**
 * Settings for createRouteHandler that the SDK accepts explicitly. The store addresses
 * (UPLOADTHING_INGEST_URL, UPLOADTHING_API_URL, UPLOADTHING_UFS_*) have no place in env(): they
 * exist only to point the SDK at the local stand-in, and the SDK reads them itself.
 */
export function uploadHandlerConfig() {
  const { UPLOADTHING_TOKEN, APP_URL } = env();
  return {
    token: UPLOADTHING_TOKEN,
    callbackUrl: `${APP_URL.replace(/\/$/, "")}/api/uploadthing`,
    // At "Info" the SDK logs every presigned upload URL, signature included.
    logLevel: "Warning" as const,
  };
}
