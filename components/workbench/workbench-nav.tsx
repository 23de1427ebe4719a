"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cx } from "@/components/ui/cx";
import { WORKBENCH_CALCULATORS } from "./calculators";

/** Links between the calculators; the current one is marked for assistive tech and by weight, not colour alone. */
export function WorkbenchNav() {
  const pathname = usePathname();
  const links = [{ href: "/workbench", title: "All calculators" }, ...WORKBENCH_CALCULATORS];
  return (
    <nav aria-label="Workbench calculators" className="border-b border-graphite-200 pb-3">
      <ul className="flex flex-wrap gap-x-1 gap-y-2 text-sm">
        {links.map((link) => {
          const current = pathname === link.href;
          return (
            <li key={link.href}>
              <Link
                href={link.href}
                aria-current={current ? "page" : undefined}
                className={cx(
                  "inline-block rounded px-3 py-1.5 no-underline",
                  current
                    ? "border border-graphite-300 bg-paper-raised font-semibold text-graphite-900 shadow-sm"
                    : "border border-transparent text-copper-700 hover:bg-copper-50 hover:text-copper-800",
                )}
              >
                {link.title}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
