import "server-only";
import type { ReactElement } from "react";
import { render } from "@react-email/render";
import { env } from "@/lib/env";
import { mailClient } from "./client";

export class MailUnavailableError extends Error {
  constructor(detail: string) {
    super(`The mail service did not accept the message: ${detail}`);
    this.name = "MailUnavailableError";
  }
}

export type OutgoingMail = { to: string | string[]; subject: string; react: ReactElement; replyTo?: string };

const SEND_TIMEOUT_MS = 10_000;

/** Renders a react-email template and sends it; throws MailUnavailableError rather than hang. */
export async function sendMail(mail: OutgoingMail): Promise<{ id: string }> {
  const [html, text] = await Promise.all([render(mail.react), render(mail.react, { plainText: true })]);
  const { data, error } = await mailClient().emails.send(
    { from: env().MAIL_FROM, to: mail.to, subject: mail.subject, html, text, replyTo: mail.replyTo },
    // The SDK hands this to fetch: a mail service that hangs fails after the timeout.
    { signal: AbortSignal.timeout(SEND_TIMEOUT_MS) } as never,
  );
  if (error || !data) throw new MailUnavailableError(error?.message ?? "no answer");
  return { id: data.id };
}
