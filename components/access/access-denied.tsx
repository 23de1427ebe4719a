import Link from "next/link";
import type { AccessDecision } from "@/lib/auth/access";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

/** What a page shows instead of its content: a sign-in prompt to a visitor, "not allowed" to the wrong role. */
export function AccessDenied({ decision, next }: { decision: Extract<AccessDecision, { ok: false }>; next: string }) {
  if (decision.status === 401) {
    return (
      <section className="max-w-reading space-y-4" data-testid="sign-in-prompt">
        <PageHeader title="Sign in to continue" lede="This part of Fluxyard is for members. Signing in takes one e-mail and one click." />
        <ButtonLink href={`/sign-in?next=${encodeURIComponent(next)}`}>Sign in</ButtonLink>
      </section>
    );
  }
  return (
    <section className="max-w-reading space-y-4" data-testid="not-allowed">
      <PageHeader title="Not allowed" lede={`You are signed in, but this page is not open to you. ${decision.reason}`} />
      <p className="text-graphite-600">
        Roles are given by the platform&apos;s staff. Sellers apply from their <Link href="/account">account page</Link>.
      </p>
      <ButtonLink href="/" variant="secondary">
        Back to the start page
      </ButtonLink>
    </section>
  );
}
