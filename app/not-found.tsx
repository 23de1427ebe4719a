import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

export default function NotFound() {
  return (
    <section className="max-w-reading space-y-4" data-testid="not-found">
      <PageHeader title="Nothing on this bench" lede="The page you asked for does not exist, or it was moved or withdrawn." />
      <ButtonLink href="/">Back to the start page</ButtonLink>
    </section>
  );
}
