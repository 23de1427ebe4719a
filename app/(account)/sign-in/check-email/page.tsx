import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Check your e-mail" };

export default async function CheckEmailPage({ searchParams }: { searchParams: Promise<{ email?: string }> }) {
  const { email } = await searchParams;
  const outbox = env().MAIL_OUTBOX_URL;
  return (
    <section className="mx-auto max-w-md space-y-4">
      <PageHeader title="Check your e-mail" lede={`We sent a sign-in link${email ? ` to ${email}` : ""}. It works once and for 30 minutes.`} />
      {outbox ? (
        <p className="rounded border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-800">
          This is a local installation: messages go to the development outbox at{" "}
          <a href={outbox} className="font-mono">
            {outbox}
          </a>
          .
        </p>
      ) : null}
      <p className="text-sm text-graphite-600">
        No message after a few minutes? Look in the spam folder, or <Link href="/sign-in">ask for a new link</Link>.
      </p>
    </section>
  );
}
