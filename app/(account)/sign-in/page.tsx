import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/access/sign-in-form";
import { PageHeader } from "@/components/ui/page-header";
import { getSessionUser } from "@/lib/auth/guard";
import { safeNextPath } from "@/lib/http/safe-path";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const [{ next }, user] = await Promise.all([searchParams, getSessionUser()]);
  if (user) redirect(safeNextPath(next));
  return (
    <section className="mx-auto max-w-md space-y-6">
      <PageHeader title="Sign in to Fluxyard" lede="Enter your e-mail address and we will send you a link that signs you in. New here? The same link creates your account." />
      <SignInForm next={next} />
    </section>
  );
}
