import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";

export default function QuestionNotFound() {
  return (
    <section className="max-w-reading space-y-4">
      <PageHeader title="No such question" lede="It may have been removed, or it is still waiting for a moderator and only its author can read it." />
      <ButtonLink href="/questions" variant="secondary">
        All questions
      </ButtonLink>
    </section>
  );
}
