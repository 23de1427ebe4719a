import type { NextRequest } from "next/server";
import { createRouteHandler } from "uploadthing/next";
import { uploadHandlerConfig } from "@/lib/uploads/handler-config";
import { uploadRouter } from "./core";

// Built on the first request, not at import: `next build` loads this module without secrets.
let handler: ReturnType<typeof createRouteHandler> | undefined;

function uploadHandler() {
  handler ??= createRouteHandler({ router: uploadRouter, config: uploadHandlerConfig() });
  return handler;
}

/** The route config the client helpers read (file types and sizes per route). */
export function GET(request: NextRequest) {
  return uploadHandler().GET(request);
}

/** Upload requests from the browser, and the store's callbacks (signature-checked by the SDK). */
export function POST(request: NextRequest) {
  return uploadHandler().POST(request);
}
