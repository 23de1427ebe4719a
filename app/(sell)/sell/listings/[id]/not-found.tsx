import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

export default function ListingNotFound() {
  return (
    <section className="max-w-reading space-y-4">
      <PageHeader title="No such listing" lede="This listing does not exist, or it is not one of yours." />
      <ButtonLink href="/sell" variant="secondary">
        Back to the seller desk
      </ButtonLink>
    </section>
  );
}
