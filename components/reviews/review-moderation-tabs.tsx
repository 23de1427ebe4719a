import Link from "next/link";
import { cx } from "@/components/ui/cx";

/** Reviewer vetting and review disputes, beside the moderator's listing desk. */
export function ReviewModerationTabs({ current, counts }: { current: "reviewers" | "disputes"; counts: { applications: number; disputes: number } }) {
  const tabs = [
    { key: "desk", href: "/moderate", label: "Moderation desk" },
    { key: "reviewers", href: "/moderate/reviewers", label: `Reviewer applications (${counts.applications})` },
    { key: "disputes", href: "/moderate/disputes", label: `Review disputes (${counts.disputes})` },
  ];
  return (
    <nav aria-label="Review moderation" className="border-b border-graphite-200">
      <ul className="-mb-px flex flex-wrap gap-x-1">
        {tabs.map((tab) => (
          <li key={tab.key}>
            <Link
              href={tab.href}
              aria-current={tab.key === current ? "page" : undefined}
              className={cx(
                "inline-block border-b-2 px-3 py-2 text-sm font-medium no-underline",
                tab.key === current ? "border-copper-600 text-graphite-900" : "border-transparent text-graphite-600 hover:border-graphite-300 hover:text-graphite-900",
              )}
            >
              {tab.label}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
