import type { Metadata } from "next";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "Sign-in problem" };

const EXPLANATIONS: Record<string, string> = {
  Verification: "That sign-in link has expired or was already used. Links work once and for 30 minutes.",
  EmailSignin: "We could not send the sign-in e-mail: the mail service is not answering. Try again in a minute.",
  AccessDenied: "Signing in was refused for this address.",
  Configuration: "Sign-in is misconfigured on this installation; the operator has been told in the server log.",
};

export default async function SignInProblemPage({ searchParams }: { searchParams: Promise<{ error?: string }> }) {
  const { error } = await searchParams;
  const text = (error && EXPLANATIONS[error]) ?? "Something went wrong while signing you in.";
  return (
    <section className="mx-auto max-w-md space-y-4" data-testid="sign-in-problem">
      <PageHeader title="We could not sign you in" lede={text} />
      <ButtonLink href="/sign-in">Ask for a new link</ButtonLink>
    </section>
  );
}
