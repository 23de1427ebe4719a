import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

// The same page whether the capture does not exist or its log is private to someone else.
export default function CaptureNotFound() {
  return (
    <section className="max-w-reading space-y-4" data-testid="capture-not-found">
      <PageHeader title="No capture to show here" lede="There is no such scope capture, or the log it belongs to is not shared with you. If it is yours, sign in to read it." />
      <div className="flex flex-wrap gap-2">
        <ButtonLink href="/bench">My bench</ButtonLink>
        <ButtonLink href="/sign-in" variant="secondary">
          Sign in
        </ButtonLink>
      </div>
    </section>
  );
}
