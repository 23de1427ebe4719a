import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

export default function ReviewSessionNotFound() {
  return (
    <section className="max-w-reading space-y-4">
      <PageHeader title="No such review session" lede="This session does not exist, or you are not part of it." />
      <ButtonLink href="/reviews" variant="secondary">
        Back to your reviews
      </ButtonLink>
    </section>
  );
}
