import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { StateBadge } from "@/components/ui/state-badge";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { checkAccess } from "@/lib/auth/guard";
import { effectiveRoles, hasRole } from "@/lib/auth/access";
import { ROLE_DESCRIPTIONS } from "@/lib/auth/role-descriptions";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/account" />;
  const { user } = access;
  const roles = [...effectiveRoles(user.roles)];
  return (
    <div className="max-w-reading space-y-6">
      <PageHeader title="Your account" lede={user.email ?? undefined} />
      <Panel title="Your roles">
        <ul className="space-y-3" data-testid="account-roles">
          {roles.map((role) => (
            <li key={role} className="flex items-start gap-3">
              <StateBadge label={role} tone={role === "member" ? "neutral" : "active"} />
              <span className="text-sm text-graphite-600">{ROLE_DESCRIPTIONS[role]}</span>
            </li>
          ))}
        </ul>
      </Panel>
      {!hasRole(user, "seller") ? (
        <Panel title="Sell on Fluxyard">
          <p className="text-sm text-graphite-700">
            Wind magnetics or design boards? <Link href="/account/become-a-seller">Become a seller</Link>: tell us about your shop, and a
            moderator reviews the application.
          </p>
        </Panel>
      ) : null}
      {!hasRole(user, "reviewer") ? (
        <Panel title="Review other builders' bring-ups">
          <p className="text-sm text-graphite-700">
            Brought up a few inverters yourself? <Link href="/reviewers/apply">Apply to be a reviewer</Link> and get paid for
            reviewing builders&apos; bring-up logs.
          </p>
        </Panel>
      ) : null}
    </div>
  );
}
