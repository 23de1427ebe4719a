import "server-only";
import { env } from "@/lib/env";

/** The origin uploaded files are served from (UPLOADS_PUBLIC_ORIGIN), or undefined when unset. */
export function uploadsOrigin(): string | undefined {
  const configured = env().UPLOADS_PUBLIC_ORIGIN;
  return configured ? new URL(configured).origin : undefined;
}

/** For `<Markdown imageOrigins={…}>`: images may come from the uploads host and nowhere else. */
export function uploadImageOrigins(): string[] {
  const origin = uploadsOrigin();
  return origin ? [origin] : [];
}
