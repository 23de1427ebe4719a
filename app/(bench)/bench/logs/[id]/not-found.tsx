import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

// The same page whether the log does not exist or is private to someone else, so a private log's existence stays hidden.
export default function LogNotFound() {
  return (
    <section className="max-w-reading space-y-4" data-testid="log-not-found">
      <PageHeader
        title="No log to show here"
        lede="There is no such bring-up log, or it is not shared with you. If it is yours, sign in to read it."
      />
      <div className="flex flex-wrap gap-2">
        <ButtonLink href="/bench">My bench</ButtonLink>
        <ButtonLink href="/sign-in" variant="secondary">
          Sign in
        </ButtonLink>
      </div>
    </section>
  );
}
