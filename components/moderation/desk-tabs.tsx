import Link from "next/link";
import { cx } from "@/components/ui/cx";

export type DeskTab = "queue" | "applications" | "reviewers" | "disputes" | "posts";

/**
 * The moderator's desk: the review queue page (with held listings and policy re-checks on it) and
 * the seller applications, reviewer vetting, review disputes and the Q&A queue.
 */
export function DeskTabs({ current, counts }: { current: DeskTab; counts: { inReview: number; held: number; applications: number } }) {
  const tabs: { key: DeskTab | "held" | "rechecks"; href: string; label: string }[] = [
    { key: "queue", href: "/moderate", label: `Waiting for review (${counts.inReview})` },
    { key: "held", href: "/moderate#held", label: `Held (${counts.held})` },
    { key: "rechecks", href: "/moderate#rechecks", label: "Policy re-checks" },
    { key: "applications", href: "/moderate/applications", label: `Seller applications (${counts.applications})` },
    { key: "reviewers", href: "/moderate/reviewers", label: "Reviewer applications" },
    { key: "disputes", href: "/moderate/disputes", label: "Review disputes" },
    { key: "posts", href: "/moderate/posts", label: "Q&A queue" },
  ];
  return (
    <nav aria-label="Moderation desk" className="border-b border-graphite-200">
      <ul className="-mb-px flex flex-wrap gap-x-1">
        {tabs.map((tab) => {
          const active = tab.key === current;
          return (
            <li key={tab.key}>
              <Link
                href={tab.href}
                aria-current={active ? "page" : undefined}
                className={cx(
                  "inline-block border-b-2 px-3 py-2 text-sm font-medium no-underline",
                  active ? "border-copper-600 text-graphite-900" : "border-transparent text-graphite-600 hover:border-graphite-300 hover:text-graphite-900",
                )}
              >
                {tab.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
