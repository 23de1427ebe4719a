import "server-only";
import { Resend } from "resend";
import { env } from "@/lib/env";

let client: Resend | undefined;

export function mailClient(): Resend {
  const { RESEND_API_KEY, RESEND_BASE_URL } = env();
  client ??= new Resend(RESEND_API_KEY, RESEND_BASE_URL ? { baseUrl: RESEND_BASE_URL.replace(/\/$/, "") } : undefined);
  return client;
}
