import Link from "next/link";
import { MainsCaution } from "@/components/caution";

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-graphite-200 bg-paper-sunken">
      <div className="mx-auto max-w-6xl space-y-3 px-4 py-6 text-sm text-graphite-600">
        <MainsCaution variant="short" />
        <p>
          Fluxyard is a marketplace and help desk for people who build mains-powered power electronics.{" "}
          <Link href="/workbench">Workbench calculators</Link> give estimates for checking a design, not a certification.
        </p>
      </div>
    </footer>
  );
}
