import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { UserRoleTable } from "@/components/admin/user-role-table";
import { PageHeader } from "@/components/ui/page-header";
import { checkAccess } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "People & roles" };

export default async function AdminUsersPage() {
  const access = await checkAccess(["admin"]);
  if (!access.ok) return <AccessDenied decision={access} next="/admin/users" />;
  return (
    <div className="space-y-6">
      <PageHeader title="People & roles" lede="Grant and revoke roles. Every change is written to the audit log with your name." />
      <UserRoleTable currentUserId={access.user.id} />
    </div>
  );
}
